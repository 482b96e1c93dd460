import { Decimal, ZERO, sum } from '../../decimal.ts';
import { BatchError } from '../batch-error.ts';
import { formatPercent, unreachableMessage } from './blend-fat.ts';
import { isReachable, partnerForFixed, pearsonSquare } from './pearson-square.ts';

/** One component as the solver sees it: its name for messages and its fat % for this batch. */
export interface SolveComponent {
  readonly name: string;
  readonly fat: Decimal;
}

/** What a blend must satisfy: its components, target fat and the amounts already fixed. */
export interface BlendProblem {
  readonly components: readonly SolveComponent[];
  /** Fat % the blend must have. */
  readonly target: Decimal;
  /** Grams fixed by what is on hand, by component index. */
  readonly fixed: ReadonlyMap<number, Decimal>;
  /** The meat weight, grams, when the batch gives it; otherwise what is on hand sizes it. */
  readonly total?: Decimal;
  /** The option that set the target, named when the target is what cannot be made. */
  readonly targetOption?: string;
}

/** A refusal about the amounts on hand, or about the target when nothing is on hand. */
function refuse(problem: BlendProblem, message: string): never {
  throw new BatchError(message, problem.fixed.size > 0 ? 'on-hand' : undefined);
}

/** "A", "A and B", "A, B and C". */
function listed(names: readonly string[]): string {
  return names.length < 2 ? names.join('') : `${names.slice(0, -1).join(', ')} and ${names.at(-1)}`;
}

/**
 * The grams of every component of a blend, in the formula's order, solved exactly from two
 * balances (derived; a linear blend): Σ m = total and Σ m × fat = target × total, with the
 * amounts on hand fixed. Two equations fix two unknowns, so the blend is determinate only when:
 * - the meat weight is given and exactly two components are not on hand: those two balance the
 *   rest (the Pearson square on what is left to make; with nothing on hand, the square itself);
 * - the meat weight is not given and exactly one component is not on hand: it is added to what
 *   is on hand until the fat is right, and the batch is whatever that weighs.
 * Anything else is refused, naming what to give. No mass is ever negative: a target that the free
 * components cannot reach, or amounts on hand that leave no way to reach it, are refused too.
 * @throws BatchError naming on-hand (or no option when nothing is on hand) with the reason
 */
export function solveBlend(problem: BlendProblem): Decimal[] {
  const free = problem.components.map((_, i) => i).filter((i) => !problem.fixed.has(i));
  const grams = problem.components.map((_, i) => problem.fixed.get(i) ?? ZERO);
  if (problem.total === undefined) {
    const [only] = free;
    if (free.length !== 1) refuse(problem, underdetermined(problem, free, 1));
    grams[only] = addedToOnHand(problem, only);
    return grams;
  }
  if (free.length !== 2) refuse(problem, underdetermined(problem, free, 2));
  const [a, b] = free;
  const [first, second] = balanceTwo(problem, problem.total, a, b);
  grams[a] = first;
  grams[b] = second;
  return grams;
}

/** Why the blend cannot be solved with this many free components, and what to give instead. */
function underdetermined(problem: BlendProblem, free: readonly number[], wanted: 1 | 2): string {
  const names = free.map((i) => problem.components[i].name);
  if (free.length === 0) {
    return (
      'every trimming is fixed by what is on hand, so none is left to bring the fat to the ' +
      'target: leave one out of --on-hand'
    );
  }
  if (free.length < wanted) {
    return (
      `with the meat weight given, two trimmings must be left free to balance the weight and ` +
      `the fat, but only ${listed(names)} is: leave one more out of --on-hand, or give no ` +
      '--total or --want and let what is on hand size the batch'
    );
  }
  const give = free.length - wanted;
  const sizeHint =
    wanted === 1 ? 'give the meat weight (--total) and leave two free, or give ' : 'give ';
  return (
    `${free.length} trimmings are free (${listed(names)}), but the weight and the fat fix only ` +
    `${wanted === 2 ? 'two' : 'one with what is on hand'}: ${sizeHint}what is on hand of ` +
    `${give} more of them with --on-hand`
  );
}

/** The weight and fat grams·% of what is on hand. */
function onHandTotals(problem: BlendProblem): { mass: Decimal; fat: Decimal } {
  const entries = [...problem.fixed.entries()];
  return {
    mass: sum(entries.map(([, g]) => g)),
    fat: sum(entries.map(([i, g]) => g.times(problem.components[i].fat))),
  };
}

/** The mass of the one free component to add to what is on hand, sized by the fat alone. */
function addedToOnHand(problem: BlendProblem, index: number): Decimal {
  const { target } = problem;
  const added = problem.components[index];
  const onHand = onHandTotals(problem);
  if (problem.fixed.size === 1) {
    // Two components, one on hand: the fixed-amount rule of the fat balance as it always was.
    const [[fixedIndex, fixedGrams]] = [...problem.fixed.entries()];
    const fixedFat = problem.components[fixedIndex].fat;
    if (!isReachable(fixedFat, added.fat, target)) {
      // Neither amount can help here: the target lies outside the two fats.
      throw new BatchError(unreachableMessage(fixedFat, added.fat, target), problem.targetOption);
    }
    if (added.fat.equals(target) && !fixedFat.equals(target)) refuse(problem, unlimited(added));
    return partnerForFixed(fixedFat, added.fat, target, fixedGrams);
  }
  // Fat balance Φ + m·f = t·(W + m), so m = (Φ − t·W) ÷ (t − f); m ≥ 0 only when both signs agree.
  const excess = onHand.fat.minus(target.times(onHand.mass));
  if (excess.isZero()) return ZERO;
  const pull = target.minus(added.fat);
  if (pull.isZero()) refuse(problem, unlimited(added));
  if (excess.isNegative() !== pull.isNegative()) {
    const onHandFat = onHand.fat.div(onHand.mass);
    refuse(
      problem,
      `what is on hand is ${formatPercent(onHandFat.toDecimalPlaces(2))} fat, and adding ` +
        `${added.name} (${formatPercent(added.fat)} fat) cannot bring it to ` +
        `${formatPercent(target)}: the target must lie between the two`,
    );
  }
  return excess.div(pull);
}

function unlimited(added: SolveComponent): string {
  return (
    `the target is the fat of ${added.name} itself: with the rest fixed it would take an ` +
    'unlimited amount of it. Give --total instead.'
  );
}

/**
 * The two free components that make the rest of the batch: with nothing on hand, the Pearson
 * square of the whole batch; otherwise the same split of what is left to weigh, at the fat that
 * the rest must carry.
 */
function balanceTwo(problem: BlendProblem, total: Decimal, a: number, b: number): Decimal[] {
  const fatA = problem.components[a].fat;
  const fatB = problem.components[b].fat;
  const { target } = problem;
  if (problem.fixed.size === 0) {
    if (!isReachable(fatA, fatB, target)) {
      throw new BatchError(unreachableMessage(fatA, fatB, target), problem.targetOption);
    }
    const split = pearsonSquare(fatA, fatB, target, total);
    return [split.first, split.second];
  }
  const onHand = onHandTotals(problem);
  const rest = total.minus(onHand.mass);
  if (rest.isNegative()) {
    refuse(
      problem,
      `what is on hand weighs ${onHand.mass.toString()} g, more than the ${total.toString()} g batch`,
    );
  }
  // Fat the rest must carry, in grams·%: target × total − what is on hand carries.
  const restFat = target.times(total).minus(onHand.fat);
  const low = Decimal.min(fatA, fatB);
  const high = Decimal.max(fatA, fatB);
  if (restFat.lessThan(low.times(rest)) || restFat.greaterThan(high.times(rest))) {
    const needed = rest.isZero() ? undefined : restFat.div(rest).toDecimalPlaces(2);
    const a1 = problem.components[a].name;
    const b1 = problem.components[b].name;
    refuse(
      problem,
      needed === undefined
        ? `what is on hand makes up the whole batch, at ${formatPercent(onHand.fat.div(total).toDecimalPlaces(2))} fat, not ${formatPercent(target)}`
        : `with what is on hand, the other ${rest.toString()} g must be ${formatPercent(needed)} ` +
            `fat, which ${a1} (${formatPercent(fatA)}) and ${b1} (${formatPercent(fatB)}) ` +
            `cannot make: it must lie between ${formatPercent(low)} and ${formatPercent(high)}`,
    );
  }
  if (rest.isZero()) return [ZERO, ZERO];
  if (fatA.equals(fatB)) return [rest, ZERO];
  // m_a·f_a + m_b·f_b = restFat and m_a + m_b = rest: m_a = (restFat − f_b·rest) ÷ (f_a − f_b),
  // kept to the places the whole batch can carry, so that every line adds up to it to the last
  // digit (the rest alone could carry more places than the batch's sum keeps).
  const places = Math.max(0, Decimal.precision - 1 - total.e);
  const first = restFat.minus(fatB.times(rest)).div(fatA.minus(fatB)).toDecimalPlaces(places);
  return [first, rest.minus(first)];
}
