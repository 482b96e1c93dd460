import type { LotMeasure, TracedBatch, TracedReceipt } from '../../shared/api/trace-record.ts';
import { baseMeasureOf, isReceivedUnit } from '../../shared/stock/base-measure.ts';
import type { BatchRow, ReceiptRow } from './trace-sql.ts';

/**
 * The base measure of a lot received in a unit (migration 015): grams for kg, g, lb and oz,
 * millilitres for l, ml and gal, a count for each; grams for a unit no longer known.
 */
export function measureOf(unit: string): LotMeasure {
  return isReceivedUnit(unit) ? baseMeasureOf(unit) : 'g';
}

/**
 * The day of service a batch was recorded for, from the note every batch of a plan carries
 * ("plan: smokehouse-burger ×120 for 2026-12-18", server/plans/record-plan.ts planNote); null
 * for a batch not recorded from a plan.
 */
export function serviceDayOf(notes: string | null): string | null {
  return /^plan: \S+ ×\d+ for (\d{4}-\d{2}-\d{2})/.exec(notes ?? '')?.[1] ?? null;
}

/** A received lot's row as a trace shows it, with its site's key when one is given. */
export function tracedReceipt(row: ReceiptRow, site?: string): TracedReceipt {
  return {
    kind: 'receipt',
    lotCode: row.lot_code,
    item: row.item,
    itemName: row.item_name,
    supplier: row.supplier,
    supplierLot: row.supplier_lot,
    establishment: row.establishment,
    packedOn: row.packed_on,
    useBy: row.use_by,
    receivedOn: row.received_on,
    amount: row.amount,
    remaining: row.remaining,
    measure: measureOf(row.unit),
    emptiedOn: row.emptied_on,
    decision: row.decision,
    ...(site === undefined ? {} : { site }),
  };
}

/** A batch's row as a trace shows it, with its site's key when one is given. */
export function tracedBatch(row: BatchRow, site?: string): TracedBatch {
  return {
    kind: 'batch',
    lotCode: row.lot_code,
    formula: { id: row.formula_id, title: row.formula_title },
    status: row.status,
    startedOn: row.started_on,
    readyOn: row.ready_on,
    serviceDay: serviceDayOf(row.notes),
    ...(site === undefined ? {} : { site }),
  };
}
