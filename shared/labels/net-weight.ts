import { Decimal, ZERO } from '../decimal.ts';
import { GRAMS_PER_OUNCE } from '../units/mass.ts';

/** A package's net weight as a label declares it, in US customary units and in metric. */
export interface NetWeight {
  /** "1 lb 8 oz" or "12 oz". */
  readonly us: string;
  /** "680 g". */
  readonly metric: string;
  /** "Net wt 1 lb 8 oz (680 g)". */
  readonly text: string;
}

/** Ounces in a pound. source: NIST SP 811 (2008), Appendix B.8 (1 lb = 16 oz avoirdupois) */
const OUNCES_PER_POUND = 16;

/** A decimal to at most `places` places, without trailing zeros: "8", "8.5", "1.36". */
function plain(value: Decimal, places = 1): string {
  return value.toFixed(places).replace(/\.?0+$/, '');
}

/**
 * The net weight statement of a package: ounces under a pound, pounds and ounces from a pound up,
 * with the metric weight after it in parentheses, "Net wt 1 lb 8 oz (680 g)".
 *
 * Both figures are rounded down (ounces to 0.1 oz, grams to the gram, kilograms
 * from 1 kg to 0.01 kg), so a label never declares
 * more than the package holds: common practice, no source.
 *
 * source (from memory, re-check against eCFR): 9 CFR 317.2(h), the net quantity of contents in
 * avoirdupois pounds and ounces, a package of 1 pound or more in pounds with any remainder in
 * ounces ("1 lb 8 oz"); 21 CFR 101.105(j) and (m), the dual declaration in US customary and
 * metric units, the metric figure in parentheses after it; "Net wt" as the label's words for
 * it, 9 CFR 317.2(h) and 21 CFR 101.105(a).
 * @throws RangeError when the weight is not above nothing
 */
export function netWeight(grams: Decimal): NetWeight {
  if (!grams.greaterThan(ZERO)) throw new RangeError('netWeight: a package weighs more than 0 g');
  const ounces = grams.div(GRAMS_PER_OUNCE).toDecimalPlaces(1, Decimal.ROUND_DOWN);
  const pounds = ounces.div(OUNCES_PER_POUND).floor();
  const rest = ounces.minus(pounds.times(OUNCES_PER_POUND));
  const us = pounds.isZero()
    ? `${plain(ounces)} oz`
    : rest.isZero()
      ? `${pounds.toFixed(0)} lb`
      : `${pounds.toFixed(0)} lb ${plain(rest)} oz`;
  const metric = grams.greaterThanOrEqualTo(1000)
    ? `${plain(grams.div(1000).toDecimalPlaces(2, Decimal.ROUND_DOWN), 2)} kg`
    : `${grams.floor().toFixed(0)} g`;
  return { us, metric, text: `Net wt ${us} (${metric})` };
}
