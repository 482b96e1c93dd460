import { type Decimal, ZERO } from '../decimal.ts';

/** A trim as the capacity count needs it: its fat % and how much of it is on hand, grams. */
export interface TrimStock {
  readonly fatPercent: Decimal;
  readonly availableGrams: Decimal;
}

/**
 * The most blend the trims on hand can make at exactly the target fat. Trims at the target all go
 * in. Every gram of a leaner trim brings (target − fat) of "missing fat" that fatter trims must
 * make up, and every gram of a fatter one (fat − target) of surplus. The side with less to give
 * goes in whole; the other side gives just as much, from the trims nearest the target first,
 * which bring the most weight for the least imbalance.
 * derived: a blend's fat is the mass-weighted mean of its trims' fats, so it is on target exactly
 * when Σ mass × (fat − target) = 0
 */
export function maxGramsAtTarget(trims: readonly TrimStock[], targetPercent: Decimal): Decimal {
  const at = trims.filter((trim) => trim.fatPercent.equals(targetPercent));
  const gap = (trim: TrimStock) => trim.fatPercent.minus(targetPercent).abs();
  const lean = trims.filter((trim) => trim.fatPercent.lessThan(targetPercent));
  const fat = trims.filter((trim) => trim.fatPercent.greaterThan(targetPercent));
  const weight = (side: readonly TrimStock[]) =>
    side.reduce((total, trim) => total.plus(trim.availableGrams), ZERO);
  const balance = (side: readonly TrimStock[]) =>
    side.reduce((total, trim) => total.plus(gap(trim).times(trim.availableGrams)), ZERO);
  const [whole, partial] = balance(lean).lessThanOrEqualTo(balance(fat))
    ? [lean, fat]
    : [fat, lean];
  let toMatch = balance(whole);
  let grams = weight(at).plus(weight(whole));
  for (const trim of [...partial].sort((a, b) => gap(a).comparedTo(gap(b)))) {
    if (toMatch.isZero()) break;
    const full = gap(trim).times(trim.availableGrams);
    if (full.lessThanOrEqualTo(toMatch)) {
      grams = grams.plus(trim.availableGrams);
      toMatch = toMatch.minus(full);
    } else {
      grams = grams.plus(toMatch.div(gap(trim)));
      toMatch = ZERO;
    }
  }
  return grams;
}
