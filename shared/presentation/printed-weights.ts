import { Decimal, sum } from '../decimal.ts';
import type { AmountLine, LineGroup } from '../calculation/calc-result.ts';
import {
  formatScaleAmount,
  isMinorAmount,
  KILOGRAM_DISPLAY_FROM,
  roundForScale,
  type ScaleAmount,
  type UnitSystem,
} from '../units/scale-amount.ts';

// One weight, one figure. A weight a sheet prints more than once — a dough in its final-dough and
// overall tables and in the figures, a sponge in its own table and as a line of the final dough,
// a mix's total weight — is printed from its exact value, rounded one way, everywhere. The total
// row of a table still adds up its printed lines; where that differs, the weight is given beside.

/** A table's exact weight and the decimal places its total row is printed to. */
export interface PrintedWeight {
  readonly exact: Decimal;
  readonly places: number;
}

// Sums of 40-digit quotients can differ from the weight they add up to in the 35th decimal.
const SAME_WITHIN_GRAMS = new Decimal('1e-12');

/** The table weight equal to an exact mass, if any. */
export function weightOf(
  weights: readonly PrintedWeight[],
  grams: Decimal,
): PrintedWeight | undefined {
  return weights.find((weight) => weight.exact.minus(grams).abs().lessThan(SAME_WITHIN_GRAMS));
}

/** A weight rounded as its total row is: to 0.1 g when the row is, else to 1 g; 0.1 oz in US units. */
export function roundWeight(weight: PrintedWeight, system: UnitSystem): ScaleAmount {
  return roundForScale(weight.exact, system, weight.places > 0);
}

/** A weight as printed: in kilograms from 10 kg, as a total row prints it. */
export function formatWeight(weight: PrintedWeight, system: UnitSystem): string {
  return formatScaleAmount(
    roundWeight(weight, system),
    weight.exact.greaterThanOrEqualTo(KILOGRAM_DISPLAY_FROM),
  );
}

function weighsFine(line: AmountLine): boolean {
  return line.role === 'curing-salt' || isMinorAmount(line.grams);
}

/**
 * A line rounded for the scale; a preferment line of a final dough is the preferment's own
 * weight and is rounded as that weight.
 */
export function roundLine(
  line: AmountLine,
  system: UnitSystem,
  weights: readonly PrintedWeight[],
): ScaleAmount {
  const whole = line.role === 'preferment' ? weightOf(weights, line.grams) : undefined;
  return whole ? roundWeight(whole, system) : roundForScale(line.grams, system, weighsFine(line));
}

/**
 * The weights of the tables with a total row, in order: each table's exact total, printed to the
 * finest places of its lines (the finest of every table of the same weight).
 */
export function tableWeights(groups: readonly LineGroup[], system: UnitSystem): PrintedWeight[] {
  const weights: PrintedWeight[] = [];
  for (const group of groups) {
    if (!group.totalLabel || group.lines.length === 0) continue;
    const exact = sum(group.lines.map((line) => line.grams));
    const places = Math.max(...group.lines.map((line) => roundLine(line, system, weights).places));
    const index = weights.findIndex((weight) => weight === weightOf(weights, exact));
    if (index < 0) weights.push({ exact, places });
    else weights[index] = { exact, places: Math.max(places, weights[index].places) };
  }
  return weights;
}
