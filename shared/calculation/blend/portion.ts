import type { Decimal } from '../../decimal.ts';
import type { Portions } from '../calc-result.ts';

/**
 * How many whole portions a batch gives, and what is left over: count = floor(batch ÷ portion),
 * remainder = batch − count × portion. Exact; nothing is rounded but the count.
 * @param batchGrams the weight to portion (the whole batch, seasoning included), grams
 * @param portionGrams the weight of one portion, grams; must be more than 0
 * @throws RangeError when the portion is not more than 0 or the batch is negative
 */
export function portionsOf(batchGrams: Decimal, portionGrams: Decimal): Portions {
  if (portionGrams.lessThanOrEqualTo(0)) {
    throw new RangeError(`portionsOf: a portion must weigh more than 0 g, not ${portionGrams}`);
  }
  if (batchGrams.isNegative()) {
    throw new RangeError(`portionsOf: a batch cannot weigh ${batchGrams} g`);
  }
  // divToInt truncates the exact quotient, so a quotient just under a whole number never
  // rounds up onto it (which plain div() then floor() could do at 40 digits).
  const whole = batchGrams.divToInt(portionGrams);
  return {
    pieceGrams: portionGrams,
    count: whole.toNumber(),
    remainderGrams: batchGrams.minus(whole.times(portionGrams)),
  };
}
