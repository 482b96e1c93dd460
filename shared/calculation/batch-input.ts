import type { Decimal } from '../decimal.ts';
import type { YeastKind } from '../formula/formula-types.ts';

/**
 * The size and conditions of one batch, already read into exact values (grams, millimetres, °C,
 * percent). Which fields apply depends on the formula's kind; parseBatchOptions() checks that.
 */
export interface BatchInput {
  /** Day the batch starts, ISO YYYY-MM-DD; needed for a ready date. */
  start?: string;
  /** Finished weight wanted, grams; the calculation works back through the yields. */
  want?: Decimal;

  // cure
  /** Green (raw, trimmed, uncured) meat weight, grams. */
  meat?: Decimal;
  /** Thickness of the thickest piece, millimetres. */
  thickness?: Decimal;
  /** Weight of the heaviest piece, grams. */
  largestPiece?: Decimal;
  /** Brine method: water weight, grams, instead of the formula's water_pct. */
  water?: Decimal;
  /** Pump method: brine injected, % of green weight, instead of the formula's pump_pct. */
  pump?: Decimal;
  /** Pump method: weight measured after injecting, grams; gives the actual pump %. */
  pumpedWeight?: Decimal;

  // dough
  /** Number of pieces to divide. */
  pieces?: number;
  /** Piece weight, grams. */
  piece?: Decimal;
  /** Allowance for dough lost in mixing and dividing, % of the mixed dough. */
  loss?: Decimal;
  /** Total flour weight, grams. */
  flour?: Decimal;
  /** Desired dough temperature, °C. */
  ddt?: Decimal;
  /** Room temperature, °C. */
  room?: Decimal;
  /** Flour temperature, °C. */
  flourTemp?: Decimal;
  /** Preferment temperature, °C. */
  prefermentTemp?: Decimal;
  /** Tap water temperature, °C; ice is added when the water must be colder. */
  tap?: Decimal;
  /** Friction factor as a temperature rise, °C. */
  friction?: Decimal;
  /** Use this kind of yeast instead of the formula's. */
  yeast?: YeastKind;

  // blend, mix, dough
  /** Total batch weight, grams (blend: meat; mix: everything; dough: mixed dough). */
  total?: Decimal;
  /** Blend: target fat %, instead of the formula's. */
  targetFat?: Decimal;
  /** Blend: components fixed by what is on hand, grams each. */
  onHand?: readonly { key: string; grams: Decimal }[];
  /** Blend: fat % measured today for components, replacing the formula's figure for the batch. */
  fatTest?: readonly { key: string; fat: Decimal }[];
  /** Blend: portion weight, grams. */
  portion?: Decimal;

  // mix
  /** Weight of the base ingredient, grams. */
  base?: Decimal;

  // assembly
  /** Units made (burgers, packs), each one unit as the assembly serves it. */
  count?: number;
}

/** Batch options as typed by a person or sent to the API: every value a string with its unit. */
export type RawBatchOptions = Partial<Record<keyof BatchInput, string>>;
