import type { PresentedResult } from '../batch-types';
import type { Weighing } from './process-types';

/** One line of the batch sheet beside what was really weighed. */
export interface WeighedLine {
  readonly name: string;
  /** The sheet's group: "Cure", "Seasoning". */
  readonly group: string;
  /** What the calculation says to weigh, as printed: "10.7 g". */
  readonly amount: string;
  /** What the calculation says, exact grams. */
  readonly grams: string;
  /** The standing weighing of the line; null until weighed. */
  readonly weighed: Weighing | null;
  /** The weighing it corrected, when it is a correction. */
  readonly replaced: Weighing | null;
}

/**
 * The sheet's lines in the sheet's order, each with its standing weighing (a line weighed twice
 * keeps the later one; a corrected one is replaced by its correction).
 */
export function weighedLines(
  result: PresentedResult,
  weighings: readonly Weighing[],
): WeighedLine[] {
  const standing = weighings.filter((w) => w.kind === 'line' && w.correctedBy === null);
  return result.groups.flatMap((group) =>
    group.lines.map((line) => {
      const weighed = standing.filter((w) => w.name === line.name).at(-1) ?? null;
      return {
        name: line.name,
        group: group.title,
        amount: line.amount,
        grams: line.grams,
        weighed,
        replaced: weighed ? (weighings.find((w) => w.id === weighed.corrects) ?? null) : null,
      };
    }),
  );
}

const BARE_NUMBER = /^\s*(\d+(?:[.,]\d+)?)\s*$/;

/**
 * The weight as the API reads it: a bare number takes the last unit of the amount beside it
 * ("10.7 g" → grams; "2 lb 3.4 oz" → ounces); a weight with a unit is sent as typed.
 */
export function weightText(typed: string, amount: string): string {
  const bare = BARE_NUMBER.exec(typed);
  if (!bare) return typed.trim();
  const unit = /([a-z]+)\s*$/i.exec(amount)?.[1] ?? 'g';
  return `${bare[1].replace(',', '.')} ${unit}`;
}

/** The server's all-clear on the actual nitrite: the panel's own line already shows that figure. */
const NITRITE_ALL_CLEAR = /^Ingoing sodium nitrite on the weights as weighed: [\d.]+ ppm, within /;

/**
 * What a weighing's answer says beyond the panel's standing lines: every message but the
 * all-clear on the nitrite, which would repeat the actual-nitrite line. Anything else (a
 * deviation, one already open) is kept, so a changed wording can only repeat, never hide.
 */
export function weighingNews(messages: readonly string[]): string[] {
  return messages.filter((message) => !NITRITE_ALL_CLEAR.test(message));
}
