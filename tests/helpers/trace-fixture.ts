// Received lots, batches and lot uses put straight into the records by SQL, for the trace and
// recall tests: receiving and consuming lots have their own code and tests, and the trace reads
// only the rows (migration 015). Amounts are Decimal text in the base measure (grams here).
import { QueryTypes, type Transaction } from 'sequelize';
import type { Database } from '../../server/db/database.ts';
import { insertNew } from '../../server/db/insert-row.ts';

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

/** One INSERT in the caller's write, on either database; the new row's id. */
async function insert(t: Transaction, db: Database, sql: string, values: unknown[]) {
  return insertNew(db, sql, values, t);
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

// The hand-drawn kitchen of the trace tests (invented, Quillmoor Smokehouse, December 2020). Arrows point from what
// was made to what it was made from; amounts in grams unless said, day used in brackets.
//
//   burger assembly 201206-BA-01 (for service 8 Dec)
//     ├─ burger grind 201204-BG-01        4000 g [12-06]
//     │    ├─ beef trim R201202-91        6000 g [12-04]   Brackenmoor Meats lot TR-301
//     │    └─ beef trim R201202-92        4000 g [12-04]   Brackenmoor Meats lot TR-302  (two lots of one item)
//     ├─ sliced bacon 201205-SL-01        1200 g [12-06]
//     │    ├─ smoked belly 201201-SB-01   5000 g [12-05]
//     │    │    ├─ pork belly R201201-91  6000 g [12-01]   Hollin Farm lot HF-4471
//     │    │    └─ curing salt R201201-92   15 g [12-01]   Saltmarsh Supply lot CS-88
//     │    └─ smoked belly 201203-SB-02   3000 g [12-05]
//     │         ├─ pork belly R201201-91  4000 g [12-03]   (the same belly lot in a second batch)
//     │         ├─ pork belly R201203-91  2000 g [12-03]   Hollin Farm lot HF-4471, delivered again
//     │         └─ curing salt R201201-92   15 g [12-03]
//     └─ brioche buns R201205-91           120 each [12-06]  Fernlea Bakery lot BUN-771
//
// So Hollin Farm's lot HF-4471 (two receipts) went forward to both smoked bellies, the sliced bacon
// made from them and the burger assembly made from that: four batches over three levels.

/** Inserts the drawn kitchen's received lots, batches and lot uses; returns the batches' ids. */
export async function insertSmokehouseLots(db: Database): Promise<Record<string, number>> {
  const receipt = (
    lot: string,
    item: string,
    itemName: string,
    supplier: string,
    supplierLot: string,
    receivedOn: string,
    amount: string,
    extra: { unit?: string; remaining?: string } = {},
  ) =>
    insertReceipt(db, {
      lot,
      item,
      itemName,
      supplier,
      supplierLot,
      receivedOn,
      amount,
      establishment: item === 'pork-belly' || item === 'beef-trim' ? 'M1234' : null,
      ...extra,
    });
  const belly1 = await receipt(
    'R201201-91',
    'pork-belly',
    'Pork belly',
    'Hollin Farm',
    'HF-4471',
    '2020-12-01',
    '12000',
    { remaining: '2000' },
  );
  const salt = await receipt(
    'R201201-92',
    'curing-salt',
    'Curing salt',
    'Saltmarsh Supply',
    'CS-88',
    '2020-12-01',
    '1000',
    { remaining: '970' },
  );
  const trim1 = await receipt(
    'R201202-91',
    'beef-trim',
    'Beef trim',
    'Brackenmoor Meats',
    'TR-301',
    '2020-12-02',
    '6000',
  );
  const trim2 = await receipt(
    'R201202-92',
    'beef-trim',
    'Beef trim',
    'Brackenmoor Meats',
    'TR-302',
    '2020-12-02',
    '8000',
    { remaining: '4000' },
  );
  const belly2 = await receipt(
    'R201203-91',
    'pork-belly',
    'Pork belly',
    'Hollin Farm',
    'HF-4471',
    '2020-12-03',
    '2000',
  );
  const buns = await receipt(
    'R201205-91',
    'brioche-bun',
    'Brioche bun',
    'Fernlea Bakery',
    'BUN-771',
    '2020-12-05',
    '240',
    { unit: 'each', remaining: '120' },
  );
  const batch = (
    lot: string,
    formula: string,
    title: string,
    status: string,
    startedOn: string,
    readyOn: string | null,
    notes: string | null = null,
  ) => insertBatch(db, { lot, formula, title, status, startedOn, readyOn, notes });
  const sb1 = await batch(
    '201201-SB-01',
    'smoked-belly',
    'Smoked belly',
    'done',
    '2020-12-01',
    '2020-12-04',
  );
  const sb2 = await batch(
    '201203-SB-02',
    'smoked-belly',
    'Smoked belly',
    'curing',
    '2020-12-03',
    '2020-12-10',
  );
  const bg = await batch(
    '201204-BG-01',
    'burger-grind',
    'Burger grind',
    'done',
    '2020-12-04',
    '2020-12-04',
  );
  const sl = await batch(
    '201205-SL-01',
    'sliced-bacon',
    'Sliced bacon',
    'done',
    '2020-12-05',
    '2020-12-05',
  );
  const ba = await batch(
    '201206-BA-01',
    'burger-assembly',
    'Burger assembly',
    'planned',
    '2020-12-06',
    '2020-12-06',
    'plan: smokehouse-burger ×120 for 2020-12-08',
  );
  const use = (
    batchId: number,
    from: { receipt?: number; source?: number },
    item: string,
    amount: string,
    usedOn: string,
  ) => insertUse(db, { batch: batchId, ...from, item, amount, usedOn });
  await use(sb1, { receipt: belly1 }, 'pork-belly', '6000', '2020-12-01');
  await use(sb1, { receipt: salt }, 'curing-salt', '15', '2020-12-01');
  await use(sb2, { receipt: belly1 }, 'pork-belly', '4000', '2020-12-03');
  await use(sb2, { receipt: belly2 }, 'pork-belly', '2000', '2020-12-03');
  await use(sb2, { receipt: salt }, 'curing-salt', '15', '2020-12-03');
  await use(bg, { receipt: trim1 }, 'beef-trim', '6000', '2020-12-04');
  await use(bg, { receipt: trim2 }, 'beef-trim', '4000', '2020-12-04');
  await use(sl, { source: sb1 }, 'smoked-belly', '5000', '2020-12-05');
  await use(sl, { source: sb2 }, 'smoked-belly', '3000', '2020-12-05');
  await use(ba, { source: bg }, 'burger-grind', '4000', '2020-12-06');
  await use(ba, { source: sl }, 'sliced-bacon', '1200', '2020-12-06');
  await use(ba, { receipt: buns }, 'brioche-bun', '120', '2020-12-06');
  return { sb1, sb2, bg, sl, ba };
}
