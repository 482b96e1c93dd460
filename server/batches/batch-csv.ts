import { optionName } from '../../shared/index.ts';
import type { BatchSummary } from '../../shared/api/batch-record.ts';

/**
 * Characters that make a spreadsheet read a cell as a formula (or, for tab and carriage return,
 * shift it into one). source: OWASP, "CSV Injection"
 */
const FORMULA_START = /^[=+\-@\t\r]/;

/**
 * One CSV field: a leading formula character is defused with a single quote, then the field is
 * quoted when it holds a comma, quote or line break, quotes doubled. source: RFC 4180 §2
 */
export function csvCell(value: string | number | boolean | null | undefined): string {
  let text = value === null || value === undefined ? '' : String(value);
  if (FORMULA_START.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** A record of fields, ended by CRLF. source: RFC 4180 §2 */
export function csvLine(cells: readonly (string | number | boolean | null | undefined)[]): string {
  return `${cells.map(csvCell).join(',')}\r\n`;
}

/** The export's columns: a header name and how to read it from a batch. */
const COLUMNS: readonly [string, (batch: BatchSummary) => string | null][] = [
  ['lot_code', (b) => b.lotCode],
  ['formula_id', (b) => b.formula.id],
  ['formula_revision', (b) => b.formula.revision],
  ['formula_title', (b) => b.formula.title],
  ['kind', (b) => b.kind],
  ['status', (b) => b.status],
  ['operator', (b) => b.operator.displayName],
  ['started_on', (b) => b.startedOn],
  ['ready_on', (b) => b.readyOn],
  ['recorded_at', (b) => b.recordedAt],
  ['updated_at', (b) => b.updatedAt],
  ['units', (b) => b.units],
  [
    'inputs',
    (b) =>
      Object.entries(b.inputs)
        .map(([key, value]) => `${optionName(key)}=${String(value)}`)
        .join('; '),
  ],
  ['checks_passed', (b) => (b.checksPassed ? 'yes' : 'no')],
  ['nitrite_ppm', (b) => b.nitritePpm],
  ['signed_off_by', (b) => b.signedOff?.by.displayName ?? null],
  ['signed_off_at', (b) => b.signedOff?.at ?? null],
  ['discard_reason', (b) => b.discardReason],
  ['notes', (b) => b.notes],
];

/** The header record. */
export const CSV_HEADER = csvLine(COLUMNS.map(([name]) => name));

/** One batch as a CSV record. */
export function batchCsvLine(batch: BatchSummary): string {
  return csvLine(COLUMNS.map(([, read]) => read(batch)));
}
