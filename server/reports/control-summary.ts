import type { LoggerSummary } from '../../shared/api/haccp-report.ts';
import type { Reading } from '../../shared/api/process-record.ts';

/** A control's standing logger readings as SQLite summed them up (haccp-queries.ts). */
export interface LoggerFigures {
  readonly count: number;
  readonly first: string;
  readonly last: string;
  readonly min: string;
  readonly max: string;
}

/** A control's readings as the report shows them: a logger's summed up, a person's each. */
export interface ReadingsShown {
  readonly logger: LoggerSummary | null;
  readonly readings: readonly Reading[];
}

/**
 * Splits a control's listed readings for the report. A data logger writes a reading a minute —
 * 1,440 a day at one control — and a reviewer reads them as a curve, not a list: they come summed
 * up (count, first and last, lowest and highest), with every one that missed the limit kept whole:
 * those a deviation names, as the judging opened it when the reading came in. Readings a person
 * entered are few, each a decision someone signed, and a correction is a person's entry whatever
 * it corrects: all listed, the corrected logger reading beside its correction.
 * @param listed the control's readings the report reads one by one: entered by hand, corrected,
 *   or named by a deviation
 * @param figures its standing logger readings summed up, when it has any
 * @param missed the ids of the readings deviations name
 */
export function readingsShown(
  listed: readonly Reading[],
  figures: LoggerFigures | undefined,
  missed: ReadonlySet<number>,
): ReadingsShown {
  const isMiss = (r: Reading): boolean =>
    r.source === 'logger' && r.correctedBy === null && missed.has(r.id);
  return {
    logger: figures ? { ...figures, missed: listed.filter(isMiss) } : null,
    readings: listed.filter((r) => !isMiss(r)),
  };
}
