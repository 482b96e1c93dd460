// Received lots, batches and lot uses put straight into the records by SQL, for the trace and
// recall tests: receiving and consuming lots have their own code and tests, and the trace reads
// only the rows (migration 015). Amounts are Decimal text in the base measure (grams here).
import { QueryTypes, type Transaction } from 'sequelize';
import type { Database } from '../../server/db/database.ts';

/** A received lot; what is not given is a plausible delivery of the demo kitchen. */
export interface FixtureReceipt {
  readonly lot: string;
  readonly item: string;
  readonly itemName: string;
  readonly supplier: string;
  readonly supplierLot: string;
  readonly establishment?: string | null;
  readonly receivedOn: string;
  readonly amount: string;
  readonly remaining?: string;
  readonly unit?: string;
  readonly useBy?: string | null;
  readonly emptiedOn?: string | null;
}

/** A batch by SQL alone: enough for a trace, not for its batch page. */
export interface FixtureBatch {
  readonly lot: string;
  readonly formula: string;
  readonly title: string;
  readonly status: string;
  readonly startedOn: string;
  readonly readyOn?: string | null;
  readonly notes?: string | null;
}

/** A batch's use of a received lot (`receipt`) or of an earlier batch (`source`), by row id. */
export interface FixtureUse {
  readonly batch: number;
  readonly receipt?: number;
  readonly source?: number;
  readonly item: string;
  readonly amount: string;
  readonly usedOn: string;
}

async function insert(t: Transaction, db: Database, sql: string, values: unknown[]) {
  const [id] = await db.sequelize.query(sql, {
    replacements: values,
    type: QueryTypes.INSERT,
    transaction: t,
  });
  return id as number;
}

/** The first person in the records, to receive and record as. */
async function someone(db: Database, t: Transaction): Promise<number> {
  const [row] = await db.sequelize.query<{ id: number }>('SELECT min(id) AS id FROM people', {
    type: QueryTypes.SELECT,
    transaction: t,
  });
  if (row?.id) return row.id;
  return insert(
    t,
    db,
    `INSERT INTO people (username, display_name, role, password_hash, created_at, updated_at)
     VALUES ('trace-fixture', 'Trace Fixture', 'cook', 'x', '2026-01-01T00:00:00Z', '2026-01-01T00:00:00Z')`,
    [],
  );
}

/** Inserts a received lot; returns its id. */
export function insertReceipt(db: Database, r: FixtureReceipt): Promise<number> {
  return db.write(async (t) =>
    insert(
      t,
      db,
      `INSERT INTO receipts (lot_code, item, item_name, supplier, supplier_lot, establishment,
         use_by, quantity, unit, amount, remaining, decision, received_at, received_on, person_id,
         emptied_on)
       VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, 'accepted', ?, ?, ?, ?)`,
      [
        r.lot,
        r.item,
        r.itemName,
        r.supplier,
        r.supplierLot,
        r.establishment ?? null,
        r.useBy ?? null,
        r.amount,
        r.unit ?? 'g',
        r.amount,
        r.remaining ?? '0',
        `${r.receivedOn}T07:30:00.000Z`,
        r.receivedOn,
        await someone(db, t),
        r.emptiedOn === undefined ? (r.remaining ? null : r.receivedOn) : r.emptiedOn,
      ],
    ),
  );
}

/** Inserts a batch by SQL; returns its id. */
export function insertBatch(db: Database, b: FixtureBatch): Promise<number> {
  return db.write(async (t) =>
    insert(
      t,
      db,
      `INSERT INTO batches (lot_code, formula_id, formula_revision, formula_title, kind, status,
         operator_id, started_on, ready_on, recorded_at, updated_at, units, inputs, result,
         checks_passed, notes)
       VALUES (?, ?, 'fixture', ?, 'mix', ?, ?, ?, ?, ?, ?, 'metric', '{}', '{}', 1, ?)`,
      [
        b.lot,
        b.formula,
        b.title,
        b.status,
        await someone(db, t),
        b.startedOn,
        b.readyOn ?? null,
        `${b.startedOn}T08:00:00.000Z`,
        `${b.startedOn}T08:00:00.000Z`,
        b.notes ?? null,
      ],
    ),
  );
}

/** Inserts a lot use; returns its id. */
export function insertUse(db: Database, u: FixtureUse): Promise<number> {
  return db.write((t) =>
    insert(
      t,
      db,
      `INSERT INTO lot_uses (batch_id, receipt_id, source_batch_id, item, amount, used_on)
       VALUES (?, ?, ?, ?, ?, ?)`,
      [u.batch, u.receipt ?? null, u.source ?? null, u.item, u.amount, u.usedOn],
    ),
  );
}
