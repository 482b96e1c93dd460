/**
 * The least-cost blend: the cheapest mix of the trims on hand that makes a batch at its target
 * fat.
 *
 * It is a small linear program: minimise Σ pᵢxᵢ subject to Σ xᵢ = M, Σ fᵢxᵢ = t·M and
 * 0 ≤ xᵢ ≤ aᵢ (price per kg, grams, fat %, grams on hand). Solver packages on npm work in binary
 * floating point, and the masses here go into a batch record, so it is solved exactly in Decimal
 * by this method:
 *
 * - With two equality constraints, an optimal vertex has two "basic" trims (of different fat)
 *   and every other trim at a bound: none of it, or all on hand.
 * - The basis is optimal when, on a chart of price against fat, the trims below the line through
 *   the two basic trims are all used and those above it unused (their reduced cost pₖ − λ − μfₖ
 *   is negative or positive). So each pair of trims fixes the others, and the two basic amounts
 *   then follow from the two constraints (the Pearson square on what is left to make).
 * - A trim exactly on the line is placed by a second and a third tie-breaking cost (its place in
 *   the list, and that squared): the lexicographic perturbation of the simplex method, which
 *   leaves an optimum of the original problem and, with these two costs, can never tie again.
 * - Every pair whose amounts fall within what is on hand is an optimal vertex; the cheapest is
 *   kept (the first, on equal cost). n trims cost n² pairs of n checks each.
 *
 * derived: linear programming duality for bounded variables (a basic feasible solution whose
 * reduced costs have the sign of its bounds is optimal); the perturbation is the textbook
 * lexicographic rule against degeneracy. The blend's fat as a weighted mean: the Pearson square,
 * "Meat Calculations" training presentation for meat-evaluation contests (issuer not
 * identified), https://slideplayer.com./slide/7660647
 */
import { Decimal, ZERO } from '../decimal.ts';
import { FAT_STANDARDS, type FatStandardKey } from '../reference/fat-standards.ts';
import { formatPercent } from '../calculation/blend/blend-fat.ts';
import { maxGramsAtTarget } from './blend-capacity.ts';

/** A trim on hand. */
export interface TrimOnHand {
  readonly name: string;
  /** Fat, % by weight. */
  readonly fatPercent: Decimal;
  /** Price per kilogram, in the kitchen's currency. */
  readonly pricePerKg: Decimal;
  /** How much is on hand, grams. */
  readonly availableGrams: Decimal;
  /** Beef fat added as such (loose fat, suet), which ground beef may not take. */
  readonly fatAsSuch?: boolean;
}

/** What the kitchen asks for. */
export interface LeastCostAsk {
  readonly trims: readonly TrimOnHand[];
  /** The fat % the batch is blended to, exactly. */
  readonly targetFatPercent: Decimal;
  readonly batchGrams: Decimal;
  /** The standard of identity the product is sold under, if any. */
  readonly standard?: FatStandardKey;
}

/** One trim's share of the blend. */
export interface BlendShare {
  readonly trim: TrimOnHand;
  readonly grams: Decimal;
  /** grams ÷ 1000 × price per kg. */
  readonly cost: Decimal;
}

/** Why an ask cannot be met. */
export type BlendRefusal =
  'above-standard' | 'not-enough-stock' | 'fat-out-of-range' | 'not-enough-at-target';

/** The cheapest blend, or the reason there is none. */
export type LeastCostBlend =
  | {
      readonly ok: true;
      /** The trims used, in the order given, with more than nothing of each. */
      readonly shares: readonly BlendShare[];
      readonly cost: Decimal;
      readonly costPerKg: Decimal;
      /** Trims the standard keeps out (fat added as such in ground beef). */
      readonly leftOut: readonly TrimOnHand[];
    }
  | { readonly ok: false; readonly refusal: BlendRefusal; readonly message: string };

const THOUSAND = new Decimal(1000);

/** Kilograms for a message, rounded down so that "at most" never says more than there is. */
function kg(grams: Decimal): string {
  return `${grams.div(THOUSAND).toDecimalPlaces(3, Decimal.ROUND_DOWN).toString()} kg`;
}

/** -1, 0 or 1: the sign of a trim's reduced cost against the line through trims i and j. */
function reducedSign(
  costs: readonly Decimal[],
  fats: readonly Decimal[],
  i: number,
  j: number,
  k: number,
): number {
  const spread = fats[j].minus(fats[i]);
  const above = costs[k]
    .minus(costs[i])
    .times(spread)
    .minus(costs[j].minus(costs[i]).times(fats[k].minus(fats[i])));
  return above.comparedTo(ZERO) * spread.comparedTo(ZERO);
}

/**
 * The amounts of one candidate vertex: trims i and j basic, the others placed by the sign of
 * their reduced cost (price, then place, then place squared); undefined when i and j cannot make
 * the rest within what is on hand.
 */
function vertex(
  trims: readonly TrimOnHand[],
  target: Decimal,
  batch: Decimal,
  i: number,
  j: number,
): Decimal[] | undefined {
  const fats = trims.map((trim) => trim.fatPercent);
  const levels = [
    trims.map((trim) => trim.pricePerKg),
    trims.map((_, place) => new Decimal(place)),
    trims.map((_, place) => new Decimal(place * place)),
  ];
  const grams = trims.map(() => ZERO);
  let rest = batch;
  let restFat = target.times(batch);
  for (let k = 0; k < trims.length; k++) {
    if (k === i || k === j) continue;
    // The third level never ties when the first two do (see the method above), so `?? 1` is moot.
    const sign = levels.map((costs) => reducedSign(costs, fats, i, j, k)).find((s) => s !== 0) ?? 1;
    if (sign < 0) {
      grams[k] = trims[k].availableGrams;
      rest = rest.minus(grams[k]);
      restFat = restFat.minus(fats[k].times(grams[k]));
    }
  }
  // Keep the decimal places the batch can carry, as the Pearson square does, so the two add up.
  const places = Math.max(0, Decimal.precision - 1 - batch.e);
  const free = restFat
    .minus(fats[j].times(rest))
    .div(fats[i].minus(fats[j]))
    .toDecimalPlaces(places);
  // 0 ÷ a negative is a signed zero, which decimal.js counts as negative: make it plain zero.
  grams[i] = free.isZero() ? ZERO : free;
  grams[j] = rest.minus(grams[i]);
  const within = (k: number) =>
    !grams[k].lessThan(ZERO) && grams[k].lessThanOrEqualTo(trims[k].availableGrams);
  return within(i) && within(j) ? grams : undefined;
}

/** Cheapest first, the first written on equal price: for trims that all have the target fat. */
function cheapestFirst(trims: readonly TrimOnHand[], batch: Decimal): Decimal[] {
  const order = trims
    .map((_, k) => k)
    .sort((a, b) => trims[a].pricePerKg.comparedTo(trims[b].pricePerKg));
  const grams = trims.map(() => ZERO);
  let rest = batch;
  for (const k of order) {
    grams[k] = Decimal.min(rest, trims[k].availableGrams);
    rest = rest.minus(grams[k]);
  }
  return grams;
}

function costOf(trims: readonly TrimOnHand[], grams: readonly Decimal[]): Decimal {
  return trims.reduce(
    (total, trim, k) => total.plus(grams[k].times(trim.pricePerKg).div(THOUSAND)),
    ZERO,
  );
}

/** A refusal, naming any trims the standard kept out, since they may be why. */
function refused(
  why: BlendRefusal,
  message: string,
  leftOut: readonly TrimOnHand[],
): LeastCostBlend {
  const kept = leftOut.map((trim) => trim.name).join(', ');
  return {
    ok: false,
    refusal: why,
    message: kept === '' ? message : `${message} (${kept} left out: fat added as such)`,
  };
}

/** The refusal, if the ask cannot be met, in a cook's words. */
function refusal(
  ask: LeastCostAsk,
  usable: readonly TrimOnHand[],
  leftOut: readonly TrimOnHand[],
): LeastCostBlend | undefined {
  const target = ask.targetFatPercent;
  const refuse = (why: BlendRefusal, message: string) => refused(why, message, leftOut);
  if (ask.standard !== undefined) {
    const rule = FAT_STANDARDS[ask.standard];
    if (target.greaterThan(rule.maxFatPercent)) {
      return refuse(
        'above-standard',
        `${formatPercent(target)} fat is above the ${formatPercent(rule.maxFatPercent)} that ${rule.name} may have (${rule.section}).`,
      );
    }
  }
  const onHand = usable.reduce((total, trim) => total.plus(trim.availableGrams), ZERO);
  if (onHand.lessThan(ask.batchGrams)) {
    return refuse(
      'not-enough-stock',
      `The trims on hand weigh ${kg(onHand)}; the batch needs ${kg(ask.batchGrams)}.`,
    );
  }
  const fats = usable.map((trim) => trim.fatPercent);
  const leanest = Decimal.min(...fats);
  const fattest = Decimal.max(...fats);
  if (target.lessThan(leanest) || target.greaterThan(fattest)) {
    return refuse(
      'fat-out-of-range',
      `No mix of the trims on hand has ${formatPercent(target)} fat: they run from ${formatPercent(leanest)} to ${formatPercent(fattest)}.`,
    );
  }
  return undefined;
}

/**
 * The cheapest mix of the trims on hand that makes the batch at exactly its target fat. A kitchen
 * blends to its target; the standard's maximum is checked on the target itself, so the blend
 * meets the standard too. Under a standard that takes no fat added as such (ground beef), such
 * trims are left out. Asks that cannot be met are refused with the reason: a target above the
 * standard, not enough trim on hand, a target outside the trims' fats, or not enough of the
 * right trims to reach the target at that weight.
 * @throws RangeError for a batch weighing nothing, or a trim with fat outside 0–100 %, a negative
 *   price or a negative amount on hand
 */
export function leastCostBlend(ask: LeastCostAsk): LeastCostBlend {
  if (!ask.batchGrams.greaterThan(ZERO))
    throw new RangeError('leastCostBlend: the batch weighs nothing');
  for (const trim of ask.trims) {
    if (
      trim.fatPercent.lessThan(ZERO) ||
      trim.fatPercent.greaterThan(100) ||
      trim.pricePerKg.lessThan(ZERO) ||
      trim.availableGrams.lessThan(ZERO)
    ) {
      throw new RangeError(
        `leastCostBlend: ${trim.name} has a fat, price or amount that cannot be`,
      );
    }
  }
  const forbids = ask.standard !== undefined && FAT_STANDARDS[ask.standard].forbidsFatAsSuch;
  const leftOut = forbids ? ask.trims.filter((trim) => trim.fatAsSuch === true) : [];
  const usable = ask.trims.filter(
    (trim) => !leftOut.includes(trim) && trim.availableGrams.greaterThan(ZERO),
  );
  const early = refusal(ask, usable, leftOut);
  if (early !== undefined) return early;

  const target = ask.targetFatPercent;
  const batch = ask.batchGrams;
  let best: { grams: Decimal[]; cost: Decimal } | undefined;
  const consider = (grams: Decimal[] | undefined) => {
    if (grams === undefined) return;
    const cost = costOf(usable, grams);
    if (best === undefined || cost.lessThan(best.cost)) best = { grams, cost };
  };
  if (usable.every((trim) => trim.fatPercent.equals(target)))
    consider(cheapestFirst(usable, batch));
  for (let i = 0; i < usable.length; i++) {
    for (let j = i + 1; j < usable.length; j++) {
      if (!usable[i].fatPercent.equals(usable[j].fatPercent))
        consider(vertex(usable, target, batch, i, j));
    }
  }
  if (best === undefined) {
    const most = maxGramsAtTarget(usable, target);
    return refused(
      'not-enough-at-target',
      `The trims on hand make at most ${kg(most)} at ${formatPercent(target)} fat; the batch needs ${kg(batch)}.`,
      leftOut,
    );
  }
  const chosen = best;
  const shares = usable
    .map((trim, k) => ({
      trim,
      grams: chosen.grams[k],
      cost: chosen.grams[k].times(trim.pricePerKg).div(THOUSAND),
    }))
    .filter((share) => share.grams.greaterThan(ZERO));
  return {
    ok: true,
    shares,
    cost: chosen.cost,
    costPerKg: chosen.cost.div(batch.div(THOUSAND)),
    leftOut,
  };
}
