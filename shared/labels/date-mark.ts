import { addDays, isIsoDate } from '../calculation/dates.ts';

/**
 * The Food Code's longest hold for ready-to-eat, time/temperature control for safety food kept
 * refrigerated at 5 °C (41 °F) or below, in calendar days, the day of preparation being day 1.
 * source: FDA Food Code 2022, 3-501.17(A): food "prepared and held in a food establishment for
 * more than 24 hours shall be clearly marked to indicate the date or day by which the food shall
 * be consumed on the premises, sold, or discarded when held at a temperature of 5ºC (41ºF) or less
 * for a maximum of 7 days. The day of preparation shall be counted as Day 1." (text as adopted
 * word for word in Virginia, 12VAC5-421-830 A, and Oklahoma, OAC 310:257-5-60(a))
 */
export const FOOD_CODE_DAYS = 7;

/** Where a date mark's number of days comes from. */
export type DateMarkBasis = 'food-code' | 'validated';

/** A use-by date worked out for a label or a container in the cold room. */
export interface DateMark {
  /** The day counted as day 1: the day of preparation, or an earlier ingredient's (ISO date). */
  readonly dayOne: string;
  /** The last day the food may be consumed, sold or served (ISO date). */
  readonly useBy: string;
  /** Days counted, day 1 included. */
  readonly days: number;
  readonly basis: DateMarkBasis;
  /** Where the number of days comes from, in words for the record. */
  readonly source: string;
}

/** A kitchen's own shelf life, validated for this product, with the study or letter behind it. */
export interface ValidatedShelfLife {
  /** Days, the day of preparation counted as day 1. */
  readonly days: number;
  /** The validation, in the kitchen's words: "challenge study, Quillmoor lab report 14, 2026". */
  readonly source: string;
}

/** What a date mark is worked out from. */
export interface DateMarkInput {
  /** The day the food was prepared (ISO date). */
  readonly preparedOn: string;
  /**
   * Days on which ready-to-eat, refrigerated ingredients that went into it were prepared or
   * opened: the food keeps the date of the earliest (Food Code 3-501.17(C)).
   */
  readonly ingredientDays?: readonly string[];
  /** The kitchen's own validated shelf life; without it, the Food Code's 7 days. */
  readonly validated?: ValidatedShelfLife;
}

const FOOD_CODE_SOURCE =
  'FDA Food Code 2022, 3-501.17: at 5 °C (41 °F) or below, 7 days, the day of preparation counted as day 1';

/**
 * The use-by date of a ready-to-eat food held refrigerated at 5 °C (41 °F) or below: day 1 is the
 * day of preparation, so 7 days from Monday the 3rd is Sunday the 9th. A food made with an
 * earlier-prepared ready-to-eat ingredient counts from that ingredient's day. A kitchen's own
 * validated shelf life replaces the 7 days and is counted the same way.
 * source: FDA Food Code 2022, 3-501.17(A) (see {@link FOOD_CODE_DAYS}) and 3-501.17(C): an
 * ingredient "subsequently combined with additional ingredients or portions of food shall retain
 * the date marking of the earliest-prepared or first-prepared ingredient" (text as adopted in
 * Virginia, 12VAC5-421-830 C)
 * @throws RangeError for a day that is not a calendar date, or a number of days below 1 or not whole
 */
export function dateMark(input: DateMarkInput): DateMark {
  const days = [input.preparedOn, ...(input.ingredientDays ?? [])];
  const notDate = days.find((day) => !isIsoDate(day));
  if (notDate !== undefined) throw new RangeError(`dateMark: ${notDate} is not a calendar date`);
  // ISO dates sort as text in calendar order.
  const dayOne = days.reduce((earliest, day) => (day < earliest ? day : earliest));
  const validated = input.validated;
  const count = validated?.days ?? FOOD_CODE_DAYS;
  if (!Number.isInteger(count) || count < 1) {
    throw new RangeError(`dateMark: a shelf life of ${count} days is not a whole number of days`);
  }
  return {
    dayOne,
    // Day 1 is dayOne itself, so the last day is count − 1 days after it.
    useBy: addDays(dayOne, count - 1),
    days: count,
    basis: validated === undefined ? 'food-code' : 'validated',
    source: validated === undefined ? FOOD_CODE_SOURCE : validated.source,
  };
}
