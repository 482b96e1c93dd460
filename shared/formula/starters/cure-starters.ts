/** Starter cure formulas, one per method, with every key explained in a comment. */
export const CURE_STARTERS = {
  dry: `kind: cure
method: dry                # rubbed on; every pct below is % of the green (raw, trimmed) weight
product: bacon             # bacon, whole-muscle or comminuted: selects the nitrite limit
species: pork              # beef, pork, lamb, veal or poultry, or a list: the cooking temperature
ingredients:
  - { name: fine sea salt, pct: 2.25, salt: 100 }
  # nitrite and salt say what the curing salt holds, % by weight: read them off its label.
  - { name: curing salt (6.25 % nitrite), pct: 0.25, nitrite: 6.25, salt: 93.75 }
  - { name: brown sugar, pct: 1.0 }
hold:
  days_per_cm: 2           # or days_per_inch, days_per_kg, days_per_lb, or a fixed days: 7
  min_days: 5
  flip_every_days: 2
yields:                    # optional: weight after each step, % of the weight before it
  smoke: 90
steps:
  - Mix the cure and rub it over every surface.
  - Bag, press out the air and hold at 2–4 °C; turn the bag as the hold says.
`,
  brine: `kind: cure
method: brine              # held in brine to equilibrium; every pct is % of meat + water
product: whole-muscle      # bacon, whole-muscle or comminuted: selects the nitrite limit
species: pork              # beef, pork, lamb, veal or poultry, or a list: the cooking temperature
brine:
  water_pct: 60            # water as % of green weight
ingredients:
  - { name: kosher salt, pct: 2.5, salt: 100 }
  - { name: curing salt (6.25 % nitrite), pct: 0.25, nitrite: 6.25, salt: 93.75 }
  - { name: white sugar, pct: 1.5 }
hold:
  days_per_cm: 1.5
  min_days: 3
steps:
  - Dissolve everything in the water and chill the brine before the meat goes in.
  - Keep the meat under the brine, at 2–4 °C.
`,
  pump: `kind: cure
method: pump               # injected; every pct is the level wanted in the meat, % of green weight
product: whole-muscle      # bacon, whole-muscle or comminuted: selects the nitrite limit
species: pork              # beef, pork, lamb, veal or poultry, or a list: the cooking temperature
brine:
  pump_pct: 10             # brine injected, % of green weight
  cover_pct: 30            # cover brine the meat rests in, % of green weight (0 for none)
  extra_pct: 10            # injection brine made beyond that, for injector losses
  # cover_pickup_pct: 2    # pick-up from the cover as you measured it, % of green weight
# The cover brine's own make-up, each pct % of the cover brine (water is the rest). Without it the
# cover is the injected brine, and its nitrite counts with the meat: meat and all pickle as one
# system (FSIS immersion method two), or the measured pick-up (method one).
cover_brine:
  - { name: kosher salt, pct: 3, salt: 100 }
ingredients:
  - { name: kosher salt, pct: 1.8, salt: 100 }
  - { name: curing salt (6.25 % nitrite), pct: 0.25, nitrite: 6.25, salt: 93.75 }
  - { name: white sugar, pct: 0.8 }
hold:
  days: 3
steps:
  - Dissolve everything in cold water; keep the brine at 2–4 °C.
  - Make the cover brine apart, from salt and water only, and chill it.
  - Inject evenly to the target weight, then hold under the cover brine.
`,
} as const;
