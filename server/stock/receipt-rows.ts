import type { Receipt } from '../../shared/api/receipt.ts';
import type { Deviation } from '../../shared/api/process-record.ts';
import { baseMeasureOf, type ReceivedUnit } from '../../shared/stock/base-measure.ts';

/** A receipts row with the name of who took it in and the deviation it opened. */
export interface ReceiptRow {
  id: number;
  lot_code: string;
  item: string;
  item_name: string;
  supplier: string;
  supplier_lot: string;
  establishment: string | null;
  packed_on: string | null;
  use_by: string | null;
  quantity: string;
  unit: string;
  amount: string;
  remaining: string;
  unit_cost: string | null;
  temperature_c: string | null;
  frozen: number;
  decision: Receipt['decision'];
  received_at: string;
  received_on: string;
  person_id: number;
  person_name: string | null;
  note: string | null;
  emptied_on: string | null;
  limit_words: string | null;
  limit_source: string | null;
  found: string | null;
  deviation_id: number | null;
}

/** The columns every read of receipts takes. */
export const RECEIPT_SELECT = `SELECT r.id, r.lot_code, r.item, r.item_name, r.supplier,
    r.supplier_lot, r.establishment, r.packed_on, r.use_by, r.quantity, r.unit, r.amount,
    r.remaining, r.unit_cost, r.temperature_c, r.frozen, r.decision, r.received_at,
    r.received_on, r.person_id, p.display_name AS person_name, r.note, r.emptied_on,
    r.limit_words, r.limit_source, r.found,
    (SELECT d.id FROM deviations d WHERE d.receipt_id = r.id ORDER BY d.id LIMIT 1) AS deviation_id
  FROM receipts r LEFT JOIN people p ON p.id = r.person_id`;

/** A row as the API sends it, with its deviation read apart. */
export function toReceipt(row: ReceiptRow, deviation: Deviation | null): Receipt {
  return {
    id: row.id,
    lotCode: row.lot_code,
    item: row.item,
    itemName: row.item_name,
    supplier: row.supplier,
    supplierLot: row.supplier_lot,
    establishment: row.establishment,
    packedOn: row.packed_on,
    useBy: row.use_by,
    quantity: row.quantity,
    unit: row.unit,
    amount: row.amount,
    remaining: row.remaining,
    measure: baseMeasureOf(row.unit as ReceivedUnit),
    unitCost: row.unit_cost,
    temperatureC: row.temperature_c,
    shippedFrozen: row.frozen === 1,
    // Rows written before the judgement was kept (none outside development) say so.
    limit: { words: row.limit_words ?? 'not recorded', source: row.limit_source },
    found: row.found ?? 'not recorded',
    decision: row.decision,
    receivedAt: row.received_at,
    receivedOn: row.received_on,
    receivedBy:
      row.person_name === null ? null : { id: row.person_id, displayName: row.person_name },
    note: row.note,
    emptiedOn: row.emptied_on,
    deviation,
  };
}
