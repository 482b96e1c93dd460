import type { AuditAction } from '../../../shared/api/audit-event.ts';
import { join, present, recipientsText, wordsOf } from './audit-words';

/**
 * The detail of an entry of the batch's process record or the equipment log in one line: what
 * was read, weighed, missed or done, never the record numbers behind it.
 * @param action The entry's action.
 * @param detail Its detail, as fields.
 * @returns The line, or undefined for an action this file does not word.
 */
export function processDetailText(
  action: AuditAction,
  detail: Record<string, unknown>,
): string | undefined {
  switch (action) {
    case 'reading-add':
      return join(
        [readingText(detail), present(detail['source']) ? `from ${wordsOf(detail['source'])}` : ''],
        ' ',
      );
    case 'reading-correct':
      return join(
        [
          `${readingText(fields(detail['from']))} → ${readingText(fields(detail['to']))}`,
          present(detail['reason']) ? `reason: ${wordsOf(detail['reason'])}` : '',
        ],
        ' · ',
      );
    case 'readings-upload':
      return present(detail['count']) ? `${wordsOf(detail['count'])} readings from a log file` : '';
    case 'deviation-open':
      return wordsOf(detail['what']);
    case 'corrective-action':
      return join(
        [
          present(detail['disposition']) ? wordsOf(detail['disposition']) : '',
          present(detail['reason']) ? `reason: ${wordsOf(detail['reason'])}` : '',
        ],
        ' · ',
      );
    case 'batch-verify':
      return present(detail['note']) ? `note: ${wordsOf(detail['note'])}` : '';
    case 'calculation-refused':
      return Array.isArray(detail['failed']) ? detail['failed'].map(wordsOf).join('; ') : '';
    case 'calibration-add':
      return join(
        [
          present(detail['reading']) ? `read ${wordsOf(detail['reading'])}` : '',
          present(detail['outcome']) ? wordsOf(detail['outcome']) : '',
        ],
        ', ',
      );
    case 'process-alert-send':
      return join([wordsOf(detail['what']), recipientsText(detail['to'])], ', ');
    default:
      return undefined;
  }
}

/** A reading as typed ("160 F"), or its value when nothing else was kept. */
function readingText(reading: Record<string, unknown>): string {
  return wordsOf(present(reading['enteredAs']) ? reading['enteredAs'] : reading['value']) || '?';
}

function fields(value: unknown): Record<string, unknown> {
  return value !== null && typeof value === 'object' ? (value as Record<string, unknown>) : {};
}
