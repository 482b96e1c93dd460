import type { Decimal } from '../../decimal.ts';
import { ppmAtEquilibrium, ppmOfPumpedPickle } from './ingoing.ts';

// How a pumped product held under a cover brine is counted. source: USDA FSIS Directive 7620.3,
// Processing Inspectors' Calculations Handbook (1995), ch. 3: the pumped-product formula for the
// injection; immersion method one (the pumped formula with the measured pick-up fraction) or
// method two (nitrite × 10⁶ ÷ (green weight + pickle weight)) for what the cover brine adds.

/** The FSIS formula a pump cure's figure was worked by, in words for the sheet. */
export const PUMP_BASIS = {
  pumped: 'injected brine, FSIS pumped-product formula',
  methodOne: 'injected brine and the measured pick-up from the cover, FSIS immersion method one',
  methodTwo: 'meat and all pickle as one system, FSIS immersion method two',
} as const;

/** One substance of a pump cure and its cover brine, grams of the batch. */
export interface PumpAndCover {
  readonly greenGrams: Decimal;
  /** Pump reached (or designed), % of green weight. */
  readonly pumpPercent: Decimal;
  /** The substance in the whole injection brine made, and that brine's weight. */
  readonly pumpSubstanceGrams: Decimal;
  readonly pumpPickleGrams: Decimal;
  /** The cover brine's weight and the substance in it (zero weight: no cover). */
  readonly coverGrams: Decimal;
  readonly coverSubstanceGrams: Decimal;
  /** Pick-up from the cover as measured, % of green weight: counts by method one. */
  readonly pickupPercent?: Decimal;
}

/** A pump cure's ingoing ppm: the injected figure, the cover's, and the larger, which is checked. */
export interface PumpIngoing {
  readonly injected: Decimal;
  /** With the cover counted, by method one or two; absent without a cover. */
  readonly withCover?: { readonly value: Decimal; readonly basis: string };
  readonly checked: Decimal;
  readonly basis: string;
}

/**
 * Ingoing ppm of a pumped product, counting the cover brine it is held in: by method one when a
 * pick-up is measured (injected figure + pick-up × the cover's strength), otherwise by method two
 * (the substance of the injected brine and the whole cover over green weight + both pickles).
 * The larger of that and the injected figure is the one checked: a weak cover dilutes the
 * method-two figure below what the injection alone put in.
 */
export function pumpIngoing(batch: PumpAndCover): PumpIngoing {
  const injected = ppmOfPumpedPickle(
    batch.pumpSubstanceGrams,
    batch.pumpPercent,
    batch.pumpPickleGrams,
  );
  if (batch.coverGrams.isZero()) return { injected, checked: injected, basis: PUMP_BASIS.pumped };
  const withCover = batch.pickupPercent
    ? {
        value: injected.plus(
          ppmOfPumpedPickle(batch.coverSubstanceGrams, batch.pickupPercent, batch.coverGrams),
        ),
        basis: PUMP_BASIS.methodOne,
      }
    : methodTwo(batch);
  return withCover.value.greaterThan(injected)
    ? { injected, withCover, checked: withCover.value, basis: withCover.basis }
    : { injected, withCover, checked: injected, basis: PUMP_BASIS.pumped };
}

function methodTwo(batch: PumpAndCover): { value: Decimal; basis: string } {
  const injectedGrams = batch.greenGrams.times(batch.pumpPercent).div(100);
  const inMeat = batch.pumpSubstanceGrams.times(injectedGrams).div(batch.pumpPickleGrams);
  return {
    value: ppmAtEquilibrium(
      inMeat.plus(batch.coverSubstanceGrams),
      batch.greenGrams,
      injectedGrams.plus(batch.coverGrams),
    ),
    basis: PUMP_BASIS.methodTwo,
  };
}
