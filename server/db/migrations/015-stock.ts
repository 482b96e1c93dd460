import type { QueryInterface } from 'sequelize';
import { runStatements } from './run-statements.ts';

/**
 * Received lots and what each batch was made from.
 *
 * receipts: one row per lot taken in (or refused) at the door: the catalogue item, the supplier
 * and their lot, the establishment number on inspected meat and poultry, the pack or kill day and
 * use-by, how much in the unit it came in, the same in the item's base measure (grams, millilitres
 * or each: `amount`), what is left of it (`remaining`, same measure), the price per unit received,
 * the temperature at the door, who took it in and the kitchen's own lot code for it. A lot is on
 * hand until `emptied_on` is set (used up or discarded); the partial index keeps the stock and
 * first-to-expire reads to the lots on hand however many were ever received.
 *
 * lot_uses: one row per lot a batch drew on: a received lot (receipt_id) or a batch made earlier
 * (source_batch_id, a grind in a burger), never both; the amount in the base measure and the day.
 * Trace back walks lot_uses_batch; trace forward walks lot_uses_receipt and lot_uses_source, so
 * each step of a recall is an index lookup at any size of log.
 *
 * A delivery taken in over its limit opens a deviation at the receiving control: deviations gains
 * the receipt it is about (its kind stays 'check', a failed check at the door).
 */
export const name = '015-stock';

const STATEMENTS = [
  `CREATE TABLE receipts (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    lot_code TEXT NOT NULL UNIQUE,
    item TEXT NOT NULL,
    item_name TEXT NOT NULL,
    supplier TEXT NOT NULL,
    supplier_lot TEXT NOT NULL,
    establishment TEXT,
    packed_on TEXT,
    use_by TEXT,
    quantity TEXT NOT NULL,
    unit TEXT NOT NULL,
    amount TEXT NOT NULL,
    remaining TEXT NOT NULL,
    unit_cost TEXT,
    temperature_c TEXT,
    frozen INTEGER NOT NULL DEFAULT 0,
    decision TEXT NOT NULL CHECK (decision IN ('accepted', 'accepted-with-action', 'refused')),
    received_at TEXT NOT NULL,
    received_on TEXT NOT NULL,
    person_id INTEGER NOT NULL REFERENCES people(id),
    note TEXT,
    emptied_on TEXT
  )`,
  'CREATE INDEX receipts_supplier_lot ON receipts (supplier_lot, supplier)',
  'CREATE INDEX receipts_received ON receipts (received_on, id)',
  `CREATE INDEX receipts_on_hand ON receipts (item, use_by, received_at)
    WHERE emptied_on IS NULL AND decision <> 'refused'`,
  `CREATE TABLE lot_uses (
    id INTEGER PRIMARY KEY AUTOINCREMENT,
    batch_id INTEGER NOT NULL REFERENCES batches(id),
    receipt_id INTEGER REFERENCES receipts(id),
    source_batch_id INTEGER REFERENCES batches(id),
    item TEXT NOT NULL,
    amount TEXT NOT NULL,
    used_on TEXT NOT NULL,
    CHECK ((receipt_id IS NULL) <> (source_batch_id IS NULL))
  )`,
  'CREATE INDEX lot_uses_batch ON lot_uses (batch_id, id)',
  'CREATE INDEX lot_uses_receipt ON lot_uses (receipt_id, batch_id) WHERE receipt_id IS NOT NULL',
  `CREATE INDEX lot_uses_source ON lot_uses (source_batch_id, batch_id)
    WHERE source_batch_id IS NOT NULL`,
  'ALTER TABLE deviations ADD COLUMN receipt_id INTEGER REFERENCES receipts(id)',
];

export async function up(queryInterface: QueryInterface): Promise<void> {
  await runStatements(queryInterface, STATEMENTS);
}
