import { Decimal } from '../decimal.ts';
import { UNITS_INPUT, UNIT_WEIGHT } from '../calculation/assembly/assembly-words.ts';
import { BEFORE_TRIM } from '../calculation/yields.ts';
import type { PresentedFigure, PresentedResult } from '../presentation/presented-result.ts';

/** What a batch gives, as costing needs it: the finished weight and the portions cut from it. */
export interface FinishedWeight {
  /** Weight at the end of the formula's yields, grams: what a finished kilogram is of. */
  readonly finishedGrams: Decimal;
  /** How the finished weight was found, in words. */
  readonly basis: string;
  /** The portions, when the formula or the caller gives a portion weight. */
  readonly portion?: PortionBasis;
}

/** Portions of one weight cut from a weight of the batch. */
export interface PortionBasis {
  /** One portion, grams. */
  readonly grams: Decimal;
  /** The weight they are cut from, grams (a blend's raw weight after its forming loss). */
  readonly fromGrams: Decimal;
  /** Whole portions the batch gives. */
  readonly count: number;
}

function exact(figures: readonly PresentedFigure[], label: string): Decimal | undefined {
  const figure = figures.find((f) => f.label === label);
  return figure?.exact === undefined ? undefined : new Decimal(figure.exact);
}

/** The last yield stage after the reference weight (trim comes before it), if any. */
function lastStage(result: PresentedResult): { step: string; grams: Decimal } | undefined {
  const stages = (result.yields ?? []).filter((stage) => stage.step !== BEFORE_TRIM);
  const last = stages.at(-1);
  return last ? { step: last.step, grams: new Decimal(last.grams) } : undefined;
}

function portionsOf(grams: Decimal, fromGrams: Decimal, count?: number): PortionBasis {
  return {
    grams,
    fromGrams,
    count: count ?? fromGrams.div(grams).floor().toNumber(),
  };
}

/**
 * The finished weight of a recorded batch and its portions, from its calculation, by kind:
 * - through the formula's yields (cure, smoke, cook, slice) when it has any: the weight after the
 *   last step;
 * - a cure without yields: its green weight (nothing known is lost);
 * - a blend without yields: the batch after its grinding and forming loss; its portions are cut
 *   from that raw weight (a 4 oz raw patty), whatever the cook yield;
 * - a dough: the dough divided into pieces, so a loss allowance the dough was scaled up by is not
 *   counted (a dough formula has no baking yield);
 * - a mix: its total weight;
 * - an assembly: its parts' weight added up, one unit (a burger, a pack) its portion.
 * A portion weight given here (150 g of sliced bacon) is of the finished weight and replaces the
 * formula's own.
 * @param portionGrams a portion of the finished product, grams, if the caller names one
 * @throws RangeError when the result lacks the figure its kind should have, or a portion of 0 g
 */
export function finishedWeight(result: PresentedResult, portionGrams?: Decimal): FinishedWeight {
  const stage = lastStage(result);
  const kind = result.formula.kind;
  let base: { grams: Decimal; basis: string } | undefined;
  let own: PortionBasis | undefined;
  if (kind === 'cure') {
    const green = exact(result.inputs, 'Green weight');
    if (green) base = { grams: green, basis: 'the green weight (no yields in the formula)' };
  } else if (kind === 'blend') {
    const formed =
      exact(result.figures, 'After grinding and forming loss') ??
      exact(result.figures, 'Total batch weight');
    const portion = exact(result.inputs, 'Portion');
    if (formed) {
      base = { grams: formed, basis: 'the blend after its grinding and forming loss' };
      if (portion) own = portionsOf(portion, formed, result.portions?.count);
    }
  } else if (kind === 'dough') {
    const mixed = exact(result.figures, 'Mixed dough');
    const piece = exact(result.inputs, 'Piece weight');
    const lossScaled = exact(result.inputs, 'Loss allowance') !== undefined;
    if (mixed && piece && result.portions && lossScaled) {
      const divided = piece.times(result.portions.count);
      base = { grams: divided, basis: 'the pieces divided (the loss allowance is lost)' };
      own = portionsOf(piece, divided, result.portions.count);
    } else if (mixed) {
      base = { grams: mixed, basis: 'the mixed dough' };
      if (piece) own = portionsOf(piece, mixed, result.portions?.count);
    }
  } else {
    const total = exact(result.figures, 'Total weight');
    if (total) base = { grams: total, basis: 'the total weight' };
    const unit = kind === 'assembly' ? exact(result.figures, UNIT_WEIGHT) : undefined;
    const units = exact(result.inputs, UNITS_INPUT);
    if (total && unit && units) own = portionsOf(unit, total, units.toNumber());
  }
  if (!base) throw new RangeError(`finishedWeight: the ${kind} result has no weight to cost`);
  const finished = stage
    ? { grams: stage.grams, basis: `the weight after the ${stage.step} yield` }
    : base;
  if (portionGrams !== undefined && !portionGrams.greaterThan(0))
    throw new RangeError('finishedWeight: a portion must weigh more than 0 g');
  const portion = portionGrams === undefined ? own : portionsOf(portionGrams, finished.grams);
  return {
    finishedGrams: finished.grams,
    basis: finished.basis,
    ...(portion ? { portion } : {}),
  };
}
