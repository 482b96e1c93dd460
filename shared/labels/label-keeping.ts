import type { LabelKeeping, ProductStorage } from '../formula/formula-types.ts';
import { dateMark, type DateMark } from './date-mark.ts';

/**
 * The handling statements of a perishable product's label.
 * source: 9 CFR 381.125(a) (poultry; read in the 2019 CFR at legalfix.com): packaged products
 * "which require special handling to maintain their wholesome condition shall have prominently
 * displayed on the principal display panel of the label the statement: 'Keep Refrigerated,'
 * 'Keep Frozen,' …"; 9 CFR 317.2(k) for meat, the same statements, from memory.
 */
export const KEEP_STATEMENTS = {
  refrigerated: 'Keep refrigerated',
  frozen: 'Keep frozen',
} as const;

/** A label's handling statement. */
export type KeepStatement = (typeof KEEP_STATEMENTS)[keyof typeof KEEP_STATEMENTS];

/** The handling statement for how a product is stored; none for a shelf-stable product. */
export function keepStatement(storage: ProductStorage | undefined): KeepStatement | undefined {
  return storage === 'refrigerated' || storage === 'frozen' ? KEEP_STATEMENTS[storage] : undefined;
}

/** A label's use-by day, or why it has none. */
export interface UseBy {
  readonly mark?: DateMark;
  /** Why there is no use-by day, in a cook's words; undefined when there is one. */
  readonly none?: string;
}

/**
 * The use-by day of a packed product. The kitchen's own validated shelf life when its formula
 * gives one; else the Food Code's date mark, which is for ready-to-eat food held refrigerated
 * only (7 days, the day of preparation counted as day 1); else none, with the reason — a raw
 * product (fresh sausage, a raw cure) is not dated by the Food Code, and a guess is not printed.
 * A food made of earlier-made parts (an assembly) counts from the earliest of them, given as
 * `ingredientDays`, however its days are set: a validated shelf life is not made longer by
 * assembling.
 * source: FDA Food Code 2022, 3-501.17(A), the words read as quoted in shared/labels/date-mark.ts;
 * that the paragraph opens with "refrigerated, ready-to-eat, time/temperature control for safety
 * food", so limiting it to such food, is from memory; 3-501.17(C), the earliest-prepared
 * ingredient's date (read as quoted in date-mark.ts).
 */
export function useByOf(
  keeping: LabelKeeping | undefined,
  packedOn: string,
  ingredientDays: readonly string[] = [],
): UseBy {
  if (keeping?.shelf_life)
    return {
      mark: dateMark({
        preparedOn: packedOn,
        ingredientDays,
        validated: { days: keeping.shelf_life.days, source: keeping.shelf_life.basis },
      }),
    };
  if (!keeping) return { none: 'how it is stored is not set in its formula' };
  if (keeping.storage !== 'refrigerated')
    return {
      none: `${keeping.storage === 'frozen' ? 'kept frozen' : 'shelf-stable'}, and no validated shelf life is set in its formula`,
    };
  if (!keeping.ready_to_eat)
    return {
      none: 'not ready to eat: the Food Code’s 7 days are for ready-to-eat food, and no validated shelf life is set in its formula',
    };
  return { mark: dateMark({ preparedOn: packedOn, ingredientDays }) };
}
