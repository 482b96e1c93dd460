import { allergenName } from '../calculation/allergens.ts';
import type { Caution } from '../calculation/calc-result.ts';
import type { Allergen } from '../formula/formula-types.ts';

/**
 * The standard cautions, each with its source. Calculations pick the ones that apply; every
 * result also carries {@link LOCAL_CODES}.
 */
export const CAUTIONS = {
  localCodes: {
    id: 'local-codes',
    text:
      'Larderbook checks against US federal rules and published guidance. Your local food code, ' +
      'your HACCP plan and licensed practice come first; where they differ, follow them.',
  },
  curingSaltHandling: {
    id: 'curing-salt-handling',
    text:
      'Curing salt is poisonous in spoonful amounts. Keep it dyed, labelled and stored apart from ' +
      'table salt; weigh it on a scale that reads 0.1 g, never by volume.',
    source: 'common practice, no source',
  },
  nitriteOnGreenWeight: {
    id: 'nitrite-on-green-weight',
    text:
      'Ingoing nitrite is figured on the green (raw, uncured) weight of the meat, and limits are ' +
      'compared on the unrounded figure, before the amounts are rounded for the scale.',
    source: "USDA FSIS Directive 7620.3, Processing Inspectors' Calculations Handbook, ch. 3",
  },
  cureUnderRefrigeration: {
    id: 'cure-under-refrigeration',
    text: 'Cure under refrigeration: keep the meat (and any brine) at 2–4 °C (36–40 °F) throughout.',
    source:
      "USDA, Pork: Slaughtering, Cutting, Preserving, and Cooking on the Farm (Farmers' Bulletin), dry and sweet pickle cures",
  },
  curedMeatIsRaw: {
    id: 'cured-meat-is-raw',
    text:
      'Cured meat is still raw: cook it to the temperature for its meat, printed next, unless ' +
      'your validated process makes it ready to eat.',
    source: 'USDA FSIS Safe Minimum Internal Temperature Chart (ham, fresh or smoked, uncooked)',
  },
  brineStrengthSaltOnly: {
    id: 'brine-strength-salt-only',
    text:
      'Brine strength counts sodium chloride only. Sugar and other dissolved ingredients make a ' +
      'salinometer read higher than the strength printed here.',
    source: 'common practice, no source',
  },
  injectedMeat: {
    id: 'injected-meat',
    text:
      'Injecting carries surface bacteria into the meat. Keep needles and brine clean and cold, ' +
      'and make fresh brine for each batch.',
    source: 'common practice, no source',
  },
  // The cooking lines of the FSIS chart; cookingCaution() picks one for a formula's meat.
  // Text read: the USDA FSIS Safe Minimum Internal Temperature Chart as reproduced at
  // https://www.justapinch.com/recipes/food-safe-cooking-temperatures.html ("Official USDA
  // Guidelines": beef, pork, veal and lamb steaks, chops, roasts 145 °F (62.8 °C) and rest at least
  // 3 minutes; ground meats 160 °F (71.1 °C); ham, fresh or smoked (uncooked) 145 °F and 3 minutes;
  // all poultry, whole bird, parts and ground, 165 °F (73.9 °C)) and at http://mrhalalmeat.ca/safe-cooking-temperatures/.
  // °C is printed to the whole degree: 62.78 → 63, 71.11 → 71, 73.89 → 74.
  wholeCutCooking: {
    id: 'whole-cut-cooking',
    text:
      'Cook whole cuts of beef, pork, lamb and veal, cured ham and bacon among them, to ' +
      '63 °C (145 °F) with a 3-minute rest before carving or eating.',
    source: 'USDA FSIS Safe Minimum Internal Temperature Chart',
  },
  groundMeatCooking: {
    id: 'ground-meat-cooking',
    text:
      'Cook ground beef, pork, lamb and veal to 71 °C (160 °F). Under the FDA Food Code a ' +
      'restaurant may cook comminuted meat to 68 °C (155 °F) held for 17 seconds (15 s in older ' +
      'editions: check yours).',
    source: 'USDA FSIS Safe Minimum Internal Temperature Chart; FDA Food Code §3-401.11',
  },
  poultryCooking: {
    id: 'poultry-cooking',
    text: 'Cook poultry, whole, in parts or ground, to 74 °C (165 °F).',
    source: 'USDA FSIS Safe Minimum Internal Temperature Chart',
  },
  unnamedMixtureCooking: {
    id: 'unnamed-mixture-cooking',
    text:
      'This product mixes meats without naming them: cook it to 74 °C (165 °F), the temperature ' +
      'for poultry and the highest for any meat.',
    source: 'USDA FSIS Safe Minimum Internal Temperature Chart (all poultry 165 °F)',
  },
  unnamedMeatCooking: {
    id: 'unnamed-meat-cooking',
    text:
      'The formula does not say which meat this is: cook it to 74 °C (165 °F), the temperature ' +
      'for poultry and the highest for any meat.',
    source: 'USDA FSIS Safe Minimum Internal Temperature Chart (all poultry 165 °F)',
  },
  keepCold: {
    id: 'keep-cold',
    text: 'Hold raw meat and cold sauces at 5 °C (41 °F) or below.',
    source: 'FDA Food Code, cold holding',
  },
  rawEgg: {
    id: 'raw-egg',
    text:
      'Contains raw egg: use pasteurized eggs, keep at 5 °C (41 °F) or below, and tell guests ' +
      'who ask; raw egg is a Salmonella risk for the young, old, pregnant and unwell.',
    source: 'FDA Food Code, cold holding and consumer advisory (§3-603.11)',
  },
  rawDough: {
    id: 'raw-dough',
    text: 'Raw dough contains raw flour (and often raw egg): do not taste it before baking.',
    source: 'from memory (FDA consumer advice on raw dough)',
  },
} as const satisfies Record<string, Caution>;

/**
 * The allergen caution for a list of allergens, or none when the list is empty; each is named as
 * the law words it, fish, crustacean shellfish and tree nuts with their kind.
 */
export function allergenCaution(allergens: readonly Allergen[]): Caution | undefined {
  if (allergens.length === 0) return undefined;
  return {
    id: 'allergens',
    text: `Contains: ${allergens.map(allergenName).join(', ')}. Keep utensils and surfaces apart and label the product.`,
    source:
      'Food Allergen Labeling and Consumer Protection Act of 2004 (21 U.S.C. 321(qq), 343(w)); FASTER Act of 2021 (sesame)',
  };
}
