import type { Decimal } from '../../decimal.ts';
import { HUNDRED, ONE, ZERO, dec } from '../../decimal.ts';
import type { DoughFormula } from '../../formula/formula-types.ts';
import { parseMass } from '../../units/mass.ts';
import { BatchError } from '../batch-error.ts';
import type { Figure, Portions } from '../calc-result.ts';
import type { BatchInput } from '../batch-input.ts';
import { doughForFlour, flourForDough, totalFormulaPercent } from './bakers-percent.ts';

/** How the batch size was given: by pieces, by mixed dough weight or by flour weight. */
export type ScaleMode = 'pieces' | 'total' | 'flour';

/** The size of a dough batch, worked out from the batch input. */
export interface DoughScale {
  readonly mode: ScaleMode;
  /** The mixed dough the formula makes at this size, grams (before any yeast conversion). */
  readonly doughGrams: Decimal;
  /** Total flour, grams: the 100 % of the baker's percentages. */
  readonly flourGrams: Decimal;
  /** Pieces to divide, with the loss allowance they were scaled by, when scaled by pieces. */
  readonly pieces?: {
    readonly count: number;
    readonly pieceGrams: Decimal;
    readonly lossPct: Decimal;
  };
  /** The batch inputs used, echoed. */
  readonly inputs: Figure[];
  readonly warnings: string[];
}

/**
 * How the loss allowance is applied, in words, for the note on the loss figure: the convention
 * of doughForPieces(), said in our own words (its source is named there and in formulas/README.md).
 */
export const LOSS_CONVENTION =
  'loss taken out of the mixed dough: dough = pieces × piece ÷ (1 − loss/100), so the pieces ' +
  'are what is left after the loss; adding the loss on top instead makes slightly less dough';

/**
 * Mixed dough needed for a number of pieces with a loss allowance, by the divide convention:
 * pieces × piece ÷ (1 − loss/100).
 * source: "Bread Formula Construction", baking-science education series part 3 (2011)
 * @param lossPct dough lost in mixing and dividing, % of the mixed dough, 0 ≤ loss < 100
 */
export function doughForPieces(count: number, pieceGrams: Decimal, lossPct: Decimal): Decimal {
  if (lossPct.isNegative() || lossPct.greaterThanOrEqualTo(HUNDRED)) {
    throw new RangeError('doughForPieces: the loss must be at least 0 % and under 100 %');
  }
  const kept = ONE.minus(lossPct.div(HUNDRED));
  return dec(count).times(pieceGrams).div(kept);
}

function pieceWeight(
  formula: DoughFormula,
  batch: BatchInput,
): { grams: Decimal; fromFormula: boolean } {
  if (batch.piece !== undefined) return { grams: batch.piece, fromFormula: false };
  if (formula.piece !== undefined) return { grams: parseMass(formula.piece), fromFormula: true };
  throw new BatchError(
    'Scaling by pieces needs a piece weight: give --piece (for example --piece "80 g"), or set piece in the formula.',
    'piece',
  );
}

function scaleByPieces(formula: DoughFormula, batch: BatchInput, totalPct: Decimal): DoughScale {
  const count = batch.pieces as number;
  if (!Number.isInteger(count) || count <= 0) {
    throw new BatchError(`--pieces must be a whole number of at least 1, not ${count}.`, 'pieces');
  }
  const piece = pieceWeight(formula, batch);
  if (!piece.grams.greaterThan(ZERO)) {
    throw new BatchError('The piece weight must be more than 0 g.', 'piece');
  }
  const lossGiven =
    batch.loss ?? (formula.loss_pct === undefined ? undefined : dec(formula.loss_pct));
  const loss = lossGiven ?? ZERO;
  if (loss.isNegative() || loss.greaterThanOrEqualTo(HUNDRED)) {
    throw new BatchError(
      `The loss allowance must be from 0 % to under 100 %, not ${loss.toString()} %.`,
      'loss',
    );
  }
  const doughGrams = doughForPieces(count, piece.grams, loss);
  const lossSource =
    batch.loss !== undefined
      ? ''
      : lossGiven !== undefined
        ? 'from the formula; '
        : 'none given, 0 %; ';
  return {
    mode: 'pieces',
    doughGrams,
    flourGrams: flourForDough(doughGrams, totalPct),
    pieces: { count, pieceGrams: piece.grams, lossPct: loss },
    inputs: [
      { label: 'Pieces', kind: 'count', value: dec(count) },
      {
        label: 'Piece weight',
        kind: 'mass',
        value: piece.grams,
        ...(piece.fromFormula ? { note: 'from the formula' } : {}),
      },
      { label: 'Loss allowance', kind: 'percent', value: loss, note: lossSource + LOSS_CONVENTION },
    ],
    warnings: [],
  };
}

/**
 * Works out the batch size from exactly one of: --pieces (with --piece or the formula's piece
 * weight, and a loss allowance), --total (mixed dough weight) or --flour (total flour weight).
 * @throws BatchError when no size, more than one, or an impossible size is given
 */
export function scaleDough(formula: DoughFormula, batch: BatchInput): DoughScale {
  const given = [
    batch.pieces !== undefined ? '--pieces' : undefined,
    batch.total !== undefined ? '--total' : undefined,
    batch.flour !== undefined ? '--flour' : undefined,
  ].filter((option): option is string => option !== undefined);
  if (given.length === 0) {
    throw new BatchError(
      'Say how big the batch is: --pieces with --piece (number and weight of pieces), ' +
        '--total (weight of mixed dough) or --flour (total flour weight).',
    );
  }
  if (given.length > 1) {
    throw new BatchError(
      `Give only one batch size; ${given.join(' and ')} were both given. Use --pieces with --piece, --total or --flour.`,
      given[1].slice(2),
    );
  }
  if (batch.pieces === undefined && batch.piece !== undefined) {
    throw new BatchError(
      '--piece is the weight of one piece and needs --pieces (how many).',
      'piece',
    );
  }
  const totalPct = totalFormulaPercent(formula.ingredients);
  if (batch.pieces !== undefined) return scaleByPieces(formula, batch, totalPct);

  const warnings =
    batch.loss !== undefined
      ? ['--loss applies only when scaling by --pieces; it was ignored for this batch.']
      : [];
  if (batch.total !== undefined) {
    if (!batch.total.greaterThan(ZERO))
      throw new BatchError('--total must be more than 0 g.', 'total');
    return {
      mode: 'total',
      doughGrams: batch.total,
      flourGrams: flourForDough(batch.total, totalPct),
      inputs: [{ label: 'Mixed dough weight', kind: 'mass', value: batch.total }],
      warnings,
    };
  }
  const flour = batch.flour as Decimal;
  if (!flour.greaterThan(ZERO)) throw new BatchError('--flour must be more than 0 g.', 'flour');
  return {
    mode: 'flour',
    doughGrams: doughForFlour(flour, totalPct),
    flourGrams: flour,
    inputs: [{ label: 'Total flour', kind: 'mass', value: flour }],
    warnings,
  };
}

/**
 * The pieces divided from a batch: what is left over is the loss allowance (and any dough gained
 * or lost by converting the yeast).
 */
export function portionsOf(scale: DoughScale, mixedGrams: Decimal): Portions | undefined {
  if (!scale.pieces) return undefined;
  const { count, pieceGrams, lossPct } = scale.pieces;
  return {
    pieceGrams,
    count,
    remainderGrams: mixedGrams.minus(dec(count).times(pieceGrams)),
    lossPct,
  };
}
