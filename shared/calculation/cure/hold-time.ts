import { Decimal } from '../../decimal.ts';
import type { CureFormula, HoldRule } from '../../formula/formula-types.ts';
import { GRAMS_PER_POUND } from '../../units/mass.ts';
import { MILLIMETRES_PER_INCH } from '../../units/length.ts';
import { formulaBrineStrength } from './brine-cure.ts';
import { salinometerDegrees } from './brine-strength.ts';

/**
 * From this strength a brine is taken to be a sweet pickle, the strong pickle the bulletin's
 * days-per-pound rule is for. Common practice, no source: the bulletin's own make-up was not to
 * hand (text read: USDA, Pork: Slaughtering, Cutting, Preserving, and Cooking on the Farm,
 * "Sweet Pickle Cure", as reproduced at https://bitlit.ru/page/en/h-russell-cross-e-curtis-green-william-r-jones-anthony-kotula-r-l-west/pork-slaughtering-cutting-preserving-and-cooking-on-the-farm/50,
 * which says the pickle is made by dissolving its ingredients in 4½ gallons of water but leaves
 * out their amounts). Equilibrium brines run far weaker, about 10–40 °SAL.
 */
export const SWEET_PICKLE_MIN_DEGREES = new Decimal(50);

/** A hold rule used when a formula has none, with where it comes from and when it applies. */
export interface DefaultHold {
  readonly rule: HoldRule;
  readonly source: string;
  /** Why this rule and not another, said before asking for a size it needs. */
  readonly why?: string;
}

/** dry: about 7 days per inch of thickness (common practice, no source: a rule of thumb). */
const DRY_HOLD: DefaultHold = {
  rule: { days_per_inch: 7 },
  source: 'rule of thumb (common practice, no source)',
};

/**
 * The rule used when a formula has no `hold:` of its own.
 * dry: {@link DRY_HOLD}.
 * brine as strong as a sweet pickle: 3½–4 days per pound of the piece; we take the long end, 4.
 * source: USDA, Pork: Slaughtering, Cutting, Preserving, and Cooking on the Farm (Farmers'
 * Bulletin), "Sweet Pickle Cure".
 * brine weaker than that (an equilibrium brine): about 1½ days per cm of thickness, the rule of
 * the project's own brine starter (common practice, no source: a rule of thumb).
 * pump: none; injected cures vary too much with cover time to guess.
 * @param strength the brine actually made, % salt; otherwise the formula's own (water_pct)
 */
export function defaultHold(formula: CureFormula, strength?: Decimal): DefaultHold | undefined {
  if (formula.method === 'dry') return DRY_HOLD;
  if (formula.method === 'pump') return undefined;
  const brine = strength ?? formulaBrineStrength(formula);
  const degrees = brine && salinometerDegrees(brine);
  if (degrees?.greaterThanOrEqualTo(SWEET_PICKLE_MIN_DEGREES)) {
    return {
      rule: { days_per_lb: 4 },
      source: `USDA Farmers' Bulletin, sweet pickle cure, 3½–4 days per pound; the brine is ${degrees.toFixed(0)} °SAL`,
    };
  }
  const weaker = degrees
    ? `the brine is ${degrees.toFixed(0)} °SAL, weaker than a sweet pickle (${SWEET_PICKLE_MIN_DEGREES} °SAL and up)`
    : 'the brine is not known to be as strong as a sweet pickle';
  return {
    rule: { days_per_cm: 1.5 },
    source: 'rule of thumb for a brine weaker than a sweet pickle: common practice, no source',
    why: `${weaker}, so its hold goes by thickness, not by the sweet pickle's days per pound`,
  };
}

/** The sizes a hold rule may be based on, and the brine made when a batch gives its own water. */
export interface HoldMeasures {
  readonly thicknessMm?: Decimal;
  readonly largestPieceGrams?: Decimal;
  /** Strength of the brine the batch holds the meat in, % salt (default: the formula's own). */
  readonly brineStrength?: Decimal;
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

/** The hold rule a cure goes by: its own, or the default for its method and brine. */
export function holdRuleOf(formula: CureFormula, strength?: Decimal): DefaultHold | undefined {
  return formula.hold
    ? { rule: formula.hold, source: "the formula's own rule" }
    : defaultHold(formula, strength);
}

/**
 * Days to hold a cure: rate × size (+ plus_days), rounded up to whole days, never under
 * min_days; or the rule's fixed days. Uses {@link defaultHold} when the formula has no rule.
 */
export function estimateHold(formula: CureFormula, measures: HoldMeasures): HoldEstimate {
  const chosen = holdRuleOf(formula, measures.brineStrength);
  if (!chosen)
    return { missing: 'this formula has no hold rule; add one under `hold:` to get a ready date' };
  const { rule, source, why } = chosen;
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
  if (!rate.measure)
    return { missing: `${why ? `${why}: ` : ''}give ${rate.option} to get a ready date` };
  const raw = rate.perDay.times(rate.measure).plus(plus);
  const days = Math.max(raw.ceil().toNumber(), atLeast);
  const text =
    `${dayCount(rate.perDay.toString())} per ${rate.unit} × ${rate.measure.toDecimalPlaces(2)} ${rate.unit}` +
    (plus ? ` + ${dayCount(String(plus))}` : '') +
    ` = ${raw.toDecimalPlaces(2)}, rounded up to ${raw.ceil()}` +
    (days > raw.ceil().toNumber() ? `, at least ${atLeast}` : '');
  return { days, rule: text, source };
}

/** "1 day", "1.5 days", "2 days". */
function dayCount(figure: string): string {
  return `${figure} ${figure === '1' ? 'day' : 'days'}`;
}
