import { QueryTypes, type Transaction } from 'sequelize';
import { siteIdOf } from '../sites/site-scope.ts';
import type { ReceiptRequest, ReceivingAction } from '../../shared/api/receipt.ts';
import { appendChange } from '../audit/append-change.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import { prefixRange } from '../batches/lot-code.ts';
import { insertNew } from '../db/insert-row.ts';
import { AppError, conflict, notFound } from '../http/app-error.ts';
import { checkAction, writeAction } from '../process/corrective-actions.ts';
import { openDeviation } from '../process/deviation-writes.ts';
import type { ProcessDeps } from '../process/judge-and-open.ts';
import type { CatalogueItems } from './catalogue-items.ts';
import { checkReceipt, type CheckedReceipt } from './receipt-input.ts';
import { dayWords } from '../../shared/presentation/date-words.ts';
import { MAX_RECEIPT_SEQUENCE, receiptLotCode, receiptPrefix } from './receipt-lot-code.ts';

/** What receiving works with: the database, its audit log, the process records, the catalogue. */
export interface StockDeps extends ProcessDeps {
  readonly catalogue: CatalogueItems;
}

/** The control a delivery's temperature is checked at, on deviations and in the HACCP report. */
export const RECEIVING_CONTROL = 'receiving';

async function select<T extends object>(
  deps: StockDeps,
  t: Transaction,
  sql: string,
  values: unknown[],
): Promise<T[]> {
  return deps.db.sequelize.query<T>(sql, {
    replacements: values,
    type: QueryTypes.SELECT,
    transaction: t,
  });
}

/**
 * The next free lot codes of the receiving days of a write, read in one query inside it: BEGIN
 * IMMEDIATE holds the write lock, so no other delivery can take one meanwhile (as batches take
 * theirs). Returns the function that gives a day's next code.
 */
async function lotCodes(
  deps: StockDeps,
  t: Transaction,
  days: readonly string[],
): Promise<(receivedOn: string) => string> {
  const sorted = [...days].sort();
  const [low] = prefixRange(receiptPrefix(sorted[0]));
  const [, high] = prefixRange(receiptPrefix(sorted[sorted.length - 1]));
  // Every code of a day has the day's prefix ("R261203-", 8 characters) and then its sequence.
  const rows = await select<{ prefix: string; n: number }>(
    deps,
    t,
    `SELECT substr(lot_code, 1, 8) AS prefix, MAX(CAST(substr(lot_code, 9) AS INTEGER)) AS n
     FROM receipts WHERE lot_code >= ? AND lot_code < ? GROUP BY prefix`,
    [low, high],
  );
  const last = new Map(rows.map((row) => [row.prefix, row.n]));
  return (receivedOn) => {
    const prefix = receiptPrefix(receivedOn);
    const sequence = (last.get(prefix) ?? 0) + 1;
    if (sequence > MAX_RECEIPT_SEQUENCE)
      throw conflict(
        'lot-codes-exhausted',
        `${MAX_RECEIPT_SEQUENCE} deliveries are already received on ${dayWords(receivedOn)}`,
      );
    last.set(prefix, sequence);
    return receiptLotCode(receivedOn, sequence);
  };
}

async function insertReceipt(
  deps: StockDeps,
  t: Transaction,
  request: ReceiptRequest,
  checked: CheckedReceipt,
  lot: string,
  at: string,
  by: ChangeOptions,
): Promise<number> {
  const onHand = checked.decision === 'refused' ? '0' : checked.amount;
  return insertNew(
    deps.db,
    `INSERT INTO receipts (lot_code, item, item_name, supplier, supplier_lot, establishment,
       packed_on, use_by, quantity, unit, amount, remaining, unit_cost, temperature_c, frozen,
       decision, received_at, received_on, person_id, note, emptied_on, limit_words,
       limit_source, found, site_id)
     VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
    [
      lot,
      checked.item.key,
      checked.itemName,
      request.supplier.trim(),
      request.supplierLot.trim(),
      checked.establishment,
      request.packedOn || null,
      request.useBy || null,
      checked.quantity,
      request.unit,
      checked.amount,
      onHand,
      checked.unitCost,
      checked.judgement.temperatureC?.toString() ?? null,
      // Shipped frozen: its limit was "frozen solid"; what was found says whether it was.
      request.shippedFrozen ? 1 : 0,
      checked.decision,
      at,
      at.slice(0, 10),
      by.actor.id,
      request.note?.trim() || null,
      // A refused delivery is never on hand.
      checked.decision === 'refused' ? at.slice(0, 10) : null,
      checked.judgement.limit.words,
      checked.judgement.limit.source,
      checked.judgement.words,
      siteIdOf(by.site),
    ],
    t,
  );
}

/**
 * Receives a delivery: checks it against its catalogue item, judges it at the door, gives it the
 * day's next lot code and writes it with its audit entry, all in one write. Taken in over its
 * limit, it opens a deviation at the receiving control and records the corrective action that
 * closes it, in the same write. Returns the new lot code.
 * @throws AppError 422 for anything checkReceipt or the corrective action refuses
 */
export async function receive(
  deps: StockDeps,
  request: ReceiptRequest,
  by: ChangeOptions,
): Promise<string> {
  const [lot] = await receiveAll(deps, [{ request, by }]);
  return lot;
}

/**
 * Receives several deliveries in one write, all or nothing, each as {@link receive} does (the
 * demo's weeks of history at once). Returns their lot codes in order.
 */
export async function receiveAll(
  deps: StockDeps,
  deliveries: readonly { readonly request: ReceiptRequest; readonly by: ChangeOptions }[],
): Promise<string[]> {
  if (!deliveries.length) return [];
  const checked = await Promise.all(
    deliveries.map(async ({ request, by }) => {
      const at = by.at ?? new Date().toISOString();
      const item = await deps.catalogue.item(request.item);
      const door = checkReceipt(request, item, at.slice(0, 10));
      const action = door.decision === 'accepted-with-action' ? request.action! : null;
      return { request, by, at, door, action, grams: action ? checkAction(action) : null };
    }),
  );
  return deps.db.write(async (t) => {
    const next = await lotCodes(
      deps,
      t,
      checked.map((delivery) => delivery.at.slice(0, 10)),
    );
    const lots: string[] = [];
    for (const delivery of checked)
      lots.push(await writeReceipt(deps, t, delivery, next(delivery.at.slice(0, 10))));
    return lots;
  });
}

/** One checked delivery written in the caller's write: the row, its audit entry, its deviation. */
async function writeReceipt(
  deps: StockDeps,
  t: Transaction,
  delivery: {
    readonly request: ReceiptRequest;
    readonly by: ChangeOptions;
    readonly at: string;
    readonly door: CheckedReceipt;
    readonly action: ReceivingAction | null;
    readonly grams: string | null;
  },
  lot: string,
): Promise<string> {
  const { request, by, at, door: checked, action, grams } = delivery;
  const id = await insertReceipt(deps, t, request, checked, lot, at, by);
  await appendChange(deps.audit, t, by, 'receipt-record', lot, {
    item: checked.item.key,
    supplier: request.supplier.trim(),
    supplierLot: request.supplierLot.trim(),
    quantity: `${checked.quantity} ${request.unit}`,
    decision: checked.decision,
    found: checked.judgement.words,
  });
  if (!action) return lot;
  const deviation = await openDeviation(
    deps.db,
    deps.audit,
    t,
    {
      batchId: null,
      receiptId: id,
      subject: lot,
      control: RECEIVING_CONTROL,
      kind: 'check',
      what: `Delivery of ${checked.itemName} from ${request.supplier.trim()} (lot ${request.supplierLot.trim()}): ${checked.judgement.words}`,
      key: `receipt ${id}/receiving`,
    },
    by,
  );
  await writeAction(
    deps,
    t,
    {
      deviationId: deviation!,
      subject: lot,
      cause: action.cause.trim(),
      restored: action.restored.trim(),
      prevention: action.prevention.trim(),
      disposition: action.disposition,
      grams,
      replaces: null,
      reason: null,
    },
    by,
    at,
  );
  return lot;
}

/**
 * Discards what is left of a lot (spoiled, past its use-by): nothing left, emptied today, with
 * the reason in the audit log. Nothing is deleted.
 * @throws AppError 404 no such lot; 409 'not-on-hand' (refused, used up or discarded already);
 *   422 'reason-needed'
 */
export async function discardReceipt(
  deps: StockDeps,
  lot: string,
  reason: string,
  by: ChangeOptions,
): Promise<void> {
  const why = reason.trim();
  if (!why)
    throw new AppError(422, 'reason-needed', 'say why the lot is discarded', [
      { field: 'reason', message: 'is needed' },
    ]);
  const at = by.at ?? new Date().toISOString();
  await deps.db.write(async (t) => {
    const [row] = await select<{
      id: number;
      remaining: string;
      unit: string;
      emptied_on: string | null;
    }>(deps, t, 'SELECT id, remaining, unit, emptied_on FROM receipts WHERE lot_code = ?', [lot]);
    if (!row) throw notFound(`no delivery with lot code ${lot}`);
    if (row.emptied_on !== null)
      throw conflict('not-on-hand', `lot ${lot} is not on hand: nothing is left of it to discard`);
    await deps.db.sequelize.query(
      "UPDATE receipts SET remaining = '0', emptied_on = ? WHERE id = ?",
      { replacements: [at.slice(0, 10), row.id], transaction: t },
    );
    await appendChange(deps.audit, t, by, 'receipt-discard', lot, {
      discarded: row.remaining,
      reason: why,
    });
  });
}
