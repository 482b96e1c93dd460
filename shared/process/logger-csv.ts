/**
 * A data-logging thermometer's CSV export read into readings. CONTRACT STUB: the core engineer
 * replaces the body.
 */

/** One row of the log: ISO time and °C as a decimal string, and the value as written. */
export interface LoggedPoint {
  readonly at: string;
  readonly value: string;
  readonly enteredAs: string;
}

/** A line of the file that cannot be read, with its 1-based number and why. */
export class LoggerCsvError extends Error {
  constructor(
    readonly line: number,
    message: string,
  ) {
    super(`line ${line}: ${message}`);
    this.name = 'LoggerCsvError';
  }
}

/**
 * Every point of the log, oldest first. Local date-times are read in `timeZone`; throws
 * LoggerCsvError at the first line it cannot read.
 */
export function parseLoggerCsv(text: string, timeZone: string): LoggedPoint[] {
  void text;
  void timeZone;
  throw new Error('parseLoggerCsv is not built yet');
}
