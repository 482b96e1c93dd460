import { Decimal, ZERO } from '../../decimal.ts';

/** The masses of the two components of a blend, in the formula's order, grams. */
export interface TwoAmounts {
  readonly first: Decimal;
  readonly second: Decimal;
}

/**
 * Whether a target fat lies between the two component fats, both ends included: only then can
 * the two make it.
 * derived: a blend's fat is the mass-weighted mean of its components' fats
 */
export function isReachable(fatA: Decimal, fatB: Decimal, target: Decimal): boolean {
  const low = Decimal.min(fatA, fatB);
  const high = Decimal.max(fatA, fatB);
  return target.greaterThanOrEqualTo(low) && target.lessThanOrEqualTo(high);
}

/**
 * Splits a batch between two components so that it has the target fat, by the Pearson square:
 * parts of A = |fat_B − target|, parts of B = |fat_A − target|, mass of A = batch × parts_A ÷
 * (parts_A + parts_B). B is the rest of the batch, so the two always add up to it exactly.
 * When both fats equal the target the batch is all of the first component. The first mass is
 * kept to the decimal places the batch weight can carry (1e-39 of it), so both add up exactly.
 * source: "Meat Calculations" training presentation for meat-evaluation contests (issuer not
 * identified), https://slideplayer.com./slide/7660647
 * @param fatA fat % of the first component
 * @param fatB fat % of the second component
 * @param target fat % the blend must have
 * @param totalGrams weight of the blend, grams
 * @throws RangeError when the target is not reachable (check {@link isReachable} first)
 */
export function pearsonSquare(
  fatA: Decimal,
  fatB: Decimal,
  target: Decimal,
  totalGrams: Decimal,
): TwoAmounts {
  if (!isReachable(fatA, fatB, target)) {
    throw new RangeError(`pearsonSquare: ${target} % is not between ${fatA} % and ${fatB} %`);
  }
  const partsA = fatB.minus(target).abs();
  const partsB = fatA.minus(target).abs();
  const allParts = partsA.plus(partsB);
  // Both fats equal the target: any split works, so take the first component alone.
  if (allParts.isZero()) return { first: totalGrams, second: ZERO };
  // Multiply before dividing: one rounding, and none at all when the parts divide the batch.
  // Then keep only the decimal places the batch weight itself can carry at full precision, so
  // that batch − first is exact and the two add up to the batch to the last digit.
  const places = Math.max(0, Decimal.precision - 1 - totalGrams.e);
  const first = totalGrams.times(partsA).div(allParts).toDecimalPlaces(places);
  return { first, second: totalGrams.minus(first) };
}

/**
 * How much of the other component to add to a fixed amount of one so that the blend has the
 * target fat. From fat balance W·f_fixed + X·f_other = (W + X)·t:
 * X = W × (f_fixed − t) ÷ (t − f_other).
 * When the fixed component is already at the target, none of the other is needed.
 * derived: the mass and fat balances of a linear blend, with a fixed amount
 * @param fixedFat fat % of the component on hand
 * @param otherFat fat % of the component to add
 * @param target fat % the blend must have
 * @param fixedGrams weight of the component on hand, grams
 * @throws RangeError when the target is not reachable, or equals the other fat while the fixed
 *   component is not at the target (that would take an unlimited amount of the other)
 */
export function partnerForFixed(
  fixedFat: Decimal,
  otherFat: Decimal,
  target: Decimal,
  fixedGrams: Decimal,
): Decimal {
  if (!isReachable(fixedFat, otherFat, target)) {
    throw new RangeError(
      `partnerForFixed: ${target} % is not between ${fixedFat} % and ${otherFat} %`,
    );
  }
  if (fixedFat.equals(target)) return ZERO;
  if (otherFat.equals(target)) {
    throw new RangeError(
      'partnerForFixed: the target equals the other fat; no finite amount reaches it',
    );
  }
  return fixedGrams.times(fixedFat.minus(target)).div(target.minus(otherFat));
}

/** The fat % of a blend computed back from its amounts: Σ(mass × fat) ÷ Σ mass. */
export function blendFatPercent(parts: readonly { grams: Decimal; fat: Decimal }[]): Decimal {
  let mass = ZERO;
  let fatMass = ZERO;
  for (const part of parts) {
    mass = mass.plus(part.grams);
    fatMass = fatMass.plus(part.grams.times(part.fat));
  }
  if (mass.isZero()) throw new RangeError('blendFatPercent: the blend weighs nothing');
  return fatMass.div(mass);
}
