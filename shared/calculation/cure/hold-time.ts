import { Decimal } from '../../decimal.ts';
import type { CureMethod, HoldRule } from '../../formula/formula-types.ts';
import { GRAMS_PER_POUND } from '../../units/mass.ts';
import { MILLIMETRES_PER_INCH } from '../../units/length.ts';

/**
 * The rule used when a formula has no `hold:` of its own.
 * dry: about 7 days per inch of thickness (common practice, no source: a rule of thumb).
 * brine: 3½–4 days per pound of the piece; we take the long end, 4. source: USDA, Pork:
 * Slaughtering, Cutting, Preserving, and Cooking on the Farm (Farmers' Bulletin), "Sweet Pickle Cure".
 * pump: none; injected cures vary too much with cover time to guess.
 */
export const DEFAULT_HOLD: Readonly<
  Record<CureMethod, { rule: HoldRule; source: string } | undefined>
> = {
  dry: { rule: { days_per_inch: 7 }, source: 'rule of thumb (common practice, no source)' },
  brine: {
    rule: { days_per_lb: 4 },
    source: "USDA Farmers' Bulletin, sweet pickle cure, 3½–4 days per pound",
  },
  pump: undefined,
};

/** The sizes a hold rule may be based on. */
export interface HoldMeasures {
  readonly thicknessMm?: Decimal;
  readonly largestPieceGrams?: Decimal;
}

/** How long to hold, or why that cannot be said. */
export type HoldEstimate =
  | { readonly days: number; readonly rule: string; readonly source: string }
  | { readonly missing: string };

interface Rate {
  readonly perDay: Decimal;
  readonly measure: Decimal | undefined;
  readonly unit: string;
  readonly option: string;
}

function rateOf(rule: HoldRule, measures: HoldMeasures): Rate | undefined {
  const { thicknessMm, largestPieceGrams } = measures;
  if (rule.days_per_cm !== undefined) {
    return {
      perDay: new Decimal(rule.days_per_cm),
      measure: thicknessMm?.div(10),
      unit: 'cm',
      option: '--thickness',
    };
  }
  if (rule.days_per_inch !== undefined) {
    return {
      perDay: new Decimal(rule.days_per_inch),
      measure: thicknessMm?.div(MILLIMETRES_PER_INCH),
      unit: 'in',
      option: '--thickness',
    };
  }
  if (rule.days_per_kg !== undefined) {
    return {
      perDay: new Decimal(rule.days_per_kg),
      measure: largestPieceGrams?.div(1000),
      unit: 'kg',
      option: '--largest-piece',
    };
  }
  if (rule.days_per_lb !== undefined) {
    return {
      perDay: new Decimal(rule.days_per_lb),
      measure: largestPieceGrams?.div(GRAMS_PER_POUND),
      unit: 'lb',
      option: '--largest-piece',
    };
  }
  return undefined;
}

/**
 * Days to hold a cure: rate × size (+ plus_days), rounded up to whole days, never under
 * min_days; or the rule's fixed days. Uses {@link DEFAULT_HOLD} when the formula has no rule.
 */
export function estimateHold(
  hold: HoldRule | undefined,
  method: CureMethod,
  measures: HoldMeasures,
): HoldEstimate {
  const fallback = DEFAULT_HOLD[method];
  const rule = hold ?? fallback?.rule;
  if (!rule)
    return { missing: 'this formula has no hold rule; add one under `hold:` to get a ready date' };
  const source = hold ? "the formula's own rule" : (fallback?.source ?? '');
  const plus = rule.plus_days ?? 0;
  const atLeast = rule.min_days ?? 1;
  if (rule.days !== undefined) {
    const days = Math.max(rule.days + plus, atLeast);
    return {
      days,
      rule: `${rule.days} days${plus ? ` + ${plus}` : ''}${days > rule.days + plus ? `, at least ${atLeast}` : ''}`,
      source,
    };
  }
  const rate = rateOf(rule, measures);
  if (!rate) return { missing: 'the hold rule gives no rate or days' };
  if (!rate.measure) return { missing: `give ${rate.option} to get a ready date` };
  const raw = rate.perDay.times(rate.measure).plus(plus);
  const days = Math.max(raw.ceil().toNumber(), atLeast);
  const text =
    `${rate.perDay} days per ${rate.unit} × ${rate.measure.toDecimalPlaces(2)} ${rate.unit}` +
    (plus ? ` + ${plus} days` : '') +
    ` = ${raw.toDecimalPlaces(2)}, rounded up to ${raw.ceil()}` +
    (days > raw.ceil().toNumber() ? `, at least ${atLeast}` : '');
  return { days, rule: text, source };
}
