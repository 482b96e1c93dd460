import type { Decimal } from '../../decimal.ts';
import type { DoughIngredient, YeastKind } from '../../formula/formula-types.ts';
import type { AmountLine, LineRole } from '../calc-result.ts';
import { gramsAtPercent } from './bakers-percent.ts';

/**
 * One line of a dough group while it is being worked out: the formula ingredient it comes from
 * and its exact amount. Turned into an {@link AmountLine} at the end.
 */
export interface DoughLine {
  /** The overall-formula ingredient; absent for the preferment line of a final dough. */
  readonly ingredient?: DoughIngredient;
  readonly name: string;
  readonly grams: Decimal;
  /** The percentage in the group's basis, carried exactly rather than worked back from grams. */
  readonly percent: Decimal;
  readonly role: LineRole;
  /** The kind of yeast now on the line, when it is yeast (after any conversion). */
  readonly yeast?: YeastKind;
  readonly note?: string;
}

/** The role a formula ingredient's line plays: plain water is weighed (or iced) as water. */
export function roleOf(ingredient: DoughIngredient): LineRole {
  return ingredient.food === 'water' ? 'water' : 'ingredient';
}

/**
 * The line for an ingredient at a percentage of a flour basis.
 * @param ingredient the overall-formula ingredient
 * @param percent its percentage of {@link basisFlour}
 * @param basisFlour the flour the percentage is of (total flour, or the preferment's flour)
 */
export function lineAtPercent(
  ingredient: DoughIngredient,
  percent: Decimal,
  basisFlour: Decimal,
): DoughLine {
  return {
    ingredient,
    name: ingredient.name,
    grams: gramsAtPercent(basisFlour, percent),
    percent,
    role: roleOf(ingredient),
    ...(ingredient.yeast ? { yeast: ingredient.yeast } : {}),
  };
}

/** The printable line. */
export function toAmountLine(line: DoughLine): AmountLine {
  return {
    name: line.name,
    grams: line.grams,
    percent: line.percent,
    role: line.role,
    ...(line.note ? { note: line.note } : {}),
  };
}
