import { Decimal } from '../../shared/decimal.ts';
import type { LoggerSummary } from '../../shared/api/haccp-report.ts';
import type { Reading } from '../../shared/api/process-record.ts';
import type { ControlState } from '../../shared/process/control-types.ts';

/** A control's readings as the report shows them: a logger's summed up, a person's each. */
export interface ReadingsShown {
  readonly logger: LoggerSummary | null;
  readonly readings: readonly Reading[];
}

/** The same instant, whatever way each ISO text writes its zone. */
const sameInstant = (a: string, b: string): boolean => Date.parse(a) === Date.parse(b);

/**
 * Splits a control's readings (oldest first, corrected ones included) for the report. A data
 * logger writes a reading a minute — 1,440 a day at one control — and a reviewer reads them as a
 * curve, not a list: they are summed up (count, first and last, lowest and highest) with every
 * one the judging called a miss kept whole. Readings a person entered are few, each is a
 * decision someone signed, and a correction is a person's entry whatever it corrects: all listed.
 * @param state the control judged on its standing readings; its misses of kind 'reading' name
 *   the readings that missed by their time
 */
export function readingsShown(
  readings: readonly Reading[],
  state: ControlState | null,
): ReadingsShown {
  const missedAt = (state?.misses ?? []).filter((miss) => miss.kind === 'reading');
  const logged = readings.filter((r) => r.source === 'logger' && r.correctedBy === null);
  const byHand = readings.filter((r) => r.source !== 'logger' || r.correctedBy !== null);
  if (!logged.length) return { logger: null, readings: byHand };
  let min = new Decimal(logged[0].value);
  let max = min;
  for (const reading of logged) {
    const value = new Decimal(reading.value);
    if (value.lt(min)) min = value;
    if (value.gt(max)) max = value;
  }
  return {
    logger: {
      count: logged.length,
      first: logged[0].at,
      last: logged[logged.length - 1].at,
      min: min.toString(),
      max: max.toString(),
      missed: logged.filter((r) => missedAt.some((miss) => sameInstant(miss.at, r.at))),
    },
    readings: byHand,
  };
}
