/**
 * The kitchen's own lot codes for what it receives: R, the receiving day YYMMDD, a dash and a
 * sequence per day from 01 (R261203-01), made as batch lot codes are (server/batches/lot-code.ts).
 */
import { lotCode } from '../batches/lot-code.ts';

/** A received lot's code; past 99 deliveries on one day the sequence grows a digit. */
export const RECEIPT_LOT_PATTERN = /^R\d{6}-\d{2,3}$/;

/** The most deliveries one day can number. */
export const MAX_RECEIPT_SEQUENCE = 999;

/** "R261203-" for 2026-12-03. */
export function receiptPrefix(receivedOn: string): string {
  const [year, month, day] = receivedOn.split('-');
  return `R${year.slice(2)}${month}${day}-`;
}

/** "R261203-01". */
export function receiptLotCode(receivedOn: string, sequence: number): string {
  return lotCode(receiptPrefix(receivedOn), sequence);
}
