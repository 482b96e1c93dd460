import { Decimal, ONE, dec, sum } from '../../decimal.ts';

/** The temperatures that set the water temperature, all in the same scale (°C in Larderbook). */
export interface DoughTemperatures {
  /** Desired dough temperature. */
  readonly ddt: Decimal;
  readonly room: Decimal;
  readonly flour: Decimal;
  /** The preferment's temperature; when given the rule uses n = 4 instead of 3. */
  readonly preferment?: Decimal;
  /**
   * Friction factor: the rise from mixing, a temperature *difference* in the same scale (in °C a
   * friction factor quoted in °F is scaled by 5/9, with no 32° offset).
   */
  readonly friction: Decimal;
}

/**
 * How many temperatures the rule counts: room, flour and water (3), plus the preferment (4).
 * source: San Francisco Baking Institute, Artisan I workshop reference material (2009)
 */
export function temperatureCount(withPreferment: boolean): number {
  return withPreferment ? 4 : 3;
}

/**
 * Water temperature for a desired dough temperature:
 * water = n × DDT − (room + flour [+ preferment]) − friction, n = 3 (straight dough) or 4 (with
 * a preferment). Holds in °F, and in °C when the friction factor is a °C difference.
 * source: San Francisco Baking Institute, Artisan I workshop reference material (2009);
 * Pizza Today, June 2018
 */
export function waterTemperature(t: DoughTemperatures): Decimal {
  const n = temperatureCount(t.preferment !== undefined);
  const known = sum([t.room, t.flour, ...(t.preferment !== undefined ? [t.preferment] : [])]);
  return dec(n).times(t.ddt).minus(known).minus(t.friction);
}

/** A trial mix: what was measured, all in the same scale. */
export interface TrialMix {
  /** The dough's temperature at the end of mixing. */
  readonly mixed: Decimal;
  readonly room: Decimal;
  readonly flour: Decimal;
  readonly water: Decimal;
  readonly preferment?: Decimal;
}

/**
 * This mixer's friction factor from a trial mix:
 * friction = n × mixed dough T − (room + flour + water [+ preferment]).
 * The 32° offsets cancel (n equals the number of temperatures subtracted), so the answer is a
 * temperature difference in the scale the temperatures were given in.
 * source: PMQ trade magazine, Spring 2003 dough Q&A column
 */
export function frictionFromTrial(trial: TrialMix): Decimal {
  const n = temperatureCount(trial.preferment !== undefined);
  const known = sum([
    trial.room,
    trial.flour,
    trial.water,
    ...(trial.preferment !== undefined ? [trial.preferment] : []),
  ]);
  return dec(n).times(trial.mixed).minus(known);
}

/** Latent heat of fusion of ice, J/g. from memory (333.55 J/g) */
const LATENT_HEAT_OF_FUSION = new Decimal('333.55');
/** Specific heat of liquid water, J/(g·K). from memory (4.186 J/(g·K)) */
const SPECIFIC_HEAT_OF_WATER = new Decimal('4.186');

/**
 * L/c rounded to 0.1 °C: how many degrees of water one gram of melting ice cools a gram of water
 * by, about 79.7 (often rounded to 80). Rounded to 79.7 so that ice figures match the
 * published form.
 * from memory, unverified: latent heat of fusion of ice 333.55 J/g ÷ specific heat of water
 * 4.186 J/(g·K) = 79.68…
 */
export const ICE_MELT_DEGREES_C: Decimal =
  LATENT_HEAT_OF_FUSION.div(SPECIFIC_HEAT_OF_WATER).toDecimalPlaces(1);

/**
 * Share of the water to weigh as ice (at 0 °C) so that tap water and ice together act like water
 * at the target temperature: (T_tap − T_target) / (T_tap + L/c), in °C.
 * Derived from a heat balance; a published bakery ice table agrees with the °F form to about
 * ±0.005 lb ice per lb water. A target below 0 °C is possible on paper: the rest of the ice then
 * melts in the mixer. A result of 1 or more means ice alone cannot cool the dough enough.
 * @returns the fraction of the water (0.15 = 15 %); 0 when the tap water is cold enough
 */
export function iceFraction(tapC: Decimal, targetC: Decimal): Decimal {
  if (!targetC.lessThan(tapC)) return new Decimal(0);
  const denominator = tapC.plus(ICE_MELT_DEGREES_C);
  // At or below −79.7 °C tap water cannot exist; guard so the division cannot flip sign.
  if (!denominator.greaterThan(0)) return ONE;
  return tapC.minus(targetC).div(denominator);
}

/** A liquid other than plain water going into the dough: its weight and temperature, °C. */
export interface OtherLiquid {
  readonly grams: Decimal;
  readonly celsius: Decimal;
}

/**
 * The plain water's own temperature when other liquids (milk, egg…) go in at theirs: the rule's
 * "water" is every liquid together, so the liquids must add up, weight for weight, to the liquid
 * temperature: water = (all liquid × liquid T − Σ other × its T) ÷ water. With the others at
 * the liquid temperature this is the liquid temperature itself. Counts every liquid's heat like
 * water's (milk's specific heat is about 3.9 J/(g·K), egg's lower: from memory), as the
 * rule counts the flour's.
 * Derived from the same heat balance as the ice share (latent and specific heat, from memory).
 * @param liquidC the liquid temperature the rule gives, °C
 * @param waterGrams the plain water, more than 0 g
 */
export function waterTemperatureWith(
  liquidC: Decimal,
  waterGrams: Decimal,
  others: readonly OtherLiquid[],
): Decimal {
  const otherGrams = sum(others.map((other) => other.grams));
  const otherHeat = sum(others.map((other) => other.grams.times(other.celsius)));
  return waterGrams.plus(otherGrams).times(liquidC).minus(otherHeat).div(waterGrams);
}
