// Fills a database for the recall benchmark: a million batches over three years, 300,000 received
// lots and five million lot uses, in three tiers as a smokehouse makes them — batches made from
// received lots (cured bellies, grinds), batches made from those (sliced bacon) and batches made
// from those (burger assemblies, each planned for a service). Written by SQL alone, each table in
// one INSERT … SELECT over a counter, so it takes a minute or two instead of an hour. The batches
// carry no calculation: a trace reads none.
// Usage: node --import tsx bench/seed-recall.ts DATA_FOLDER [BATCHES]
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import sqlite3 from 'sqlite3';
import { openDatabase } from '../server/db/database.ts';
import { PeopleRepository } from '../server/people/people-repository.ts';
import { DEMO_PEOPLE } from '../server/demo/demo-people.ts';

/** What changed in how the log is seeded: a folder seeded otherwise is seeded again. */
export const RECALL_SEED_VERSION = '1';

/** Received lots per batch: 300,000 at a million batches. */
const RECEIPTS_PER_BATCH = 0.3;
/** The days the log spans, from 1 Dec 2023. */
const DAYS = 1100;
/** Suppliers of the invented kitchen, each with its item and unit. */
const SUPPLIERS = [
  ['Hollin Farm', 'pork-belly', 'Pork belly'],
  ['Brackenmoor Meats', 'beef-trim', 'Beef trim'],
  ['Saltmarsh Supply', 'curing-salt', 'Curing salt'],
  ['Fernlea Bakery', 'brioche-bun', 'Brioche bun'],
  ['Coldbeck Dairy', 'cheddar', 'Cheddar'],
  ['Harrowgate Mill', 'flour', 'Flour'],
  ['Wrenfield Poultry', 'chicken-thigh', 'Chicken thigh'],
  ['Oakhollow Spice', 'black-pepper', 'Black pepper'],
];

function run(db: sqlite3.Database, sql: string, values: unknown[] = []): Promise<void> {
  return new Promise((resolve, reject) =>
    db.run(sql, values, (error) => (error ? reject(error) : resolve())),
  );
}

/** A counter 1…n as a CTE, for INSERT … SELECT. */
const counter = (n: number) =>
  `WITH RECURSIVE n(i) AS (SELECT 1 UNION ALL SELECT i + 1 FROM n WHERE i < ${n})`;

/** The day of row `i` (from 1) of a table with `perDay` rows a day from 1 Dec 2023. */
const dayOf = (i: string, perDay: number) =>
  `date('2023-12-01', '+' || ((${i} - 1) / ${perDay}) || ' days')`;

/**
 * Seeds a fresh data folder with `batches` batches, 0.3 received lots and 5 lot uses per batch.
 * Batch i is of tier 1 when i mod 10 < 6 (5 received lots), tier 2 when 6–8 (2 tier-1 batches
 * from the weeks before, 3 received lots) and tier 3 when 9 (2 tier-2 batches, 3 received lots).
 * A received lot is used by about 14 batches; two receipts share each supplier lot.
 */
export async function seedRecall(
  dataDir: string,
  batches: number,
  log: (text: string) => void = () => {},
): Promise<string> {
  mkdirSync(dataDir, { recursive: true });
  const file = path.join(dataDir, 'larderbook.sqlite');
  const database = await openDatabase(file);
  const people = new PeopleRepository(database);
  await database.write(async (t) => {
    for (const person of DEMO_PEOPLE) await people.add(person, t);
  });
  await database.close();

  const receipts = Math.round(batches * RECEIPTS_PER_BATCH);
  const perDay = Math.ceil(batches / DAYS);
  const receiptsPerDay = Math.ceil(receipts / DAYS);
  const db = new sqlite3.Database(file);
  await run(db, 'PRAGMA synchronous = OFF');
  await run(db, 'PRAGMA cache_size = -262144');
  const started = performance.now();
  const step = async (what: string, sql: string): Promise<void> => {
    await run(db, sql);
    log(`  ${what}: ${((performance.now() - started) / 1000).toFixed(0)} s\n`);
  };
  const suppliers = SUPPLIERS.map(
    ([name, item, title], i) =>
      `SELECT ${i} AS k, '${name}' AS name, '${item}' AS item, '${title}' AS title`,
  ).join(' UNION ALL ');
  await step(
    `${receipts} received lots`,
    `INSERT INTO receipts (lot_code, item, item_name, supplier, supplier_lot, establishment, packed_on,
       use_by, quantity, unit, amount, remaining, unit_cost, temperature_c, decision, received_at,
       received_on, person_id, emptied_on)
     ${counter(receipts)}, s AS (${suppliers}), r AS (
       SELECT i, ${dayOf('i', receiptsPerDay)} AS day, (i - 1) / 2 AS pair FROM n)
     SELECT 'R' || substr(strftime('%Y%m%d', day), 3) || '-' || printf('%03d', 1 + (i - 1) % ${receiptsPerDay}),
       s.item, s.title, s.name, 'L' || (40000 + pair), CASE WHEN s.k < 2 THEN 'M' || (1000 + s.k) END,
       day, date(day, '+14 days'), '50', 'kg', '50000',
       CASE WHEN i > ${receipts} - 500 THEN '12000' ELSE '0' END, '6.40', '3.1', 'accepted',
       day || 'T07:30:00.000Z', day, 2, CASE WHEN i > ${receipts} - 500 THEN NULL ELSE date(day, '+3 days') END
     FROM r JOIN s ON s.k = r.pair % ${SUPPLIERS.length}`,
  );
  const tier = (i: string) => `CASE WHEN ${i} % 10 < 6 THEN 1 WHEN ${i} % 10 < 9 THEN 2 ELSE 3 END`;
  await step(
    `${batches} batches`,
    `INSERT INTO batches (lot_code, formula_id, formula_revision, formula_title, kind, status,
       operator_id, started_on, ready_on, recorded_at, updated_at, units, inputs, result,
       checks_passed, notes)
     ${counter(batches)}, b AS (
       SELECT i, ${dayOf('i', perDay)} AS day, ${tier('i')} AS tier FROM n)
     SELECT substr(strftime('%Y%m%d', day), 3) || '-' ||
         CASE tier WHEN 1 THEN CASE WHEN i % 2 = 0 THEN 'QB' ELSE 'CG' END WHEN 2 THEN 'SLB' ELSE 'BA' END
         || '-' || printf('%03d', 1 + (i - 1) % ${perDay}),
       CASE tier WHEN 1 THEN CASE WHEN i % 2 = 0 THEN 'quillmoor-belly' ELSE 'chuck-grind' END
         WHEN 2 THEN 'sliced-lean-bacon' ELSE 'burger-assembly' END,
       'bench', CASE tier WHEN 1 THEN CASE WHEN i % 2 = 0 THEN 'Quillmoor belly' ELSE 'Chuck grind' END
         WHEN 2 THEN 'Sliced lean bacon' ELSE 'Burger assembly' END,
       CASE tier WHEN 1 THEN 'cure' ELSE 'mix' END,
       CASE WHEN i > ${batches} - ${perDay * 10} THEN
         CASE i % 4 WHEN 0 THEN 'planned' WHEN 1 THEN 'in-progress' WHEN 2 THEN 'curing' ELSE 'done' END
         WHEN i % 20 = 0 THEN 'discarded' ELSE 'done' END,
       1 + i % 2, day, date(day, '+' || (CASE tier WHEN 1 THEN 7 ELSE 0 END) || ' days'),
       day || 'T08:00:00.000Z', day || 'T08:00:00.000Z', 'metric', '{}', '{}', 1,
       CASE tier WHEN 3 THEN 'plan: smokehouse-burger ×120 for ' || date(day, '+2 days') END
     FROM b`,
  );
  // Five uses a batch, in order of batch (k = 0…4); each a received lot from the day or two
  // before, or for k < 2 of tiers 2 and 3, a batch of the tier below from the weeks before.
  const CHUNK = 100_000;
  for (let from = 1; from <= batches; from += CHUNK) {
    const to = Math.min(batches, from + CHUNK - 1);
    await run(db, 'BEGIN');
    await run(
      db,
      `INSERT INTO lot_uses (batch_id, receipt_id, source_batch_id, item, amount, used_on)
       WITH RECURSIVE n(i) AS (SELECT ${from} UNION ALL SELECT i + 1 FROM n WHERE i < ${to}),
       k(k) AS (VALUES (0), (1), (2), (3), (4)),
       u AS (SELECT i, k, ${tier('i')} AS tier FROM n, k),
       s AS (SELECT i, k, tier,
         min(${receipts}, CAST((i - 1) * ${RECEIPTS_PER_BATCH} AS INTEGER) - k * 97 - (i * 7919) % 191)
           AS receipt,
         CASE WHEN tier > 1 AND k < 2 THEN
           i - i % 10 - 10 * (1 + (i * 31 + k * 17) % 40) + CASE tier WHEN 2 THEN (i + k) % 6 ELSE 6 + (i + k) % 3 END
         END AS source FROM u),
       -- At the very start of the log there is nothing before: the first lots, spread evenly.
       v AS (SELECT i, k,
         CASE WHEN source >= 1 THEN NULL WHEN receipt >= 1 THEN receipt ELSE 1 + (i * 5 + k) % 600 END
           AS receipt,
         CASE WHEN source >= 1 THEN source END AS source FROM s)
       SELECT i, receipt, source,
         CASE WHEN receipt IS NULL THEN 'batch' ELSE 'item' END,
         CASE WHEN receipt IS NULL THEN '4000' ELSE '3500' END,
         ${dayOf('i', perDay)}
       FROM v ORDER BY i, k`,
    );
    await run(db, 'COMMIT');
    log(
      `\r  lot uses for ${to} of ${batches} batches: ${((performance.now() - started) / 1000).toFixed(0)} s`,
    );
  }
  log('\n');
  await step('ANALYZE', 'ANALYZE');
  await new Promise((resolve) => db.close(resolve));
  writeFileSync(path.join(dataDir, 'seed-version'), `${RECALL_SEED_VERSION} ${batches}\n`);
  return file;
}

if (process.argv[1]?.endsWith('seed-recall.ts')) {
  const [folder, rows] = process.argv.slice(2);
  if (!folder) throw new Error('usage: seed-recall.ts DATA_FOLDER [BATCHES]');
  await seedRecall(folder, Number(rows ?? 1_000_000), (text) => process.stdout.write(text));
}
