// Fills a PostgreSQL database with a large batch log for the benchmarks, as seed-log.ts fills a
// SQLite file: the same real results of the demo formulas, spread the same way over about three
// years with the same mix of statuses and sign-offs, written by PostgreSQL itself a chunk of whole
// days at a time (INSERT … SELECT over generate_series), not a statement a row.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { loadConfig } from '../server/config.ts';
import { openContext } from '../server/main-context.ts';
import { DEMO_PEOPLE } from '../server/demo/demo-people.ts';
import { RECENT_DAYS, RECENT_STATUSES, templates } from './seed-log.ts';

/** Rows written by one statement, rounded up to whole days. */
const CHUNK = 100_000;

/** How many batches the database at `url` holds; 0 when it has no log yet. */
export async function countPostgresBatches(url: string): Promise<number> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const result = await client.query<{ n: string }>('SELECT COUNT(*) AS n FROM batches');
    return Number(result.rows[0].n);
  } catch {
    return 0; // no batches table: not a seeded log
  } finally {
    await client.end();
  }
}

/**
 * Seeds `rows` batches into the PostgreSQL database at `url` (its schema brought up to date
 * first): its batches, their events and its people are emptied and written again.
 */
export async function seedPostgresLog(
  url: string,
  rows: number,
  log: (text: string) => void = () => {},
): Promise<void> {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'larder-seed-'));
  // The server's own start brings the schema up to date; the demo people only, as seed-log.ts.
  const context = await openContext(
    loadConfig({ LARDER_DATA: dataDir, LARDER_MODE: 'demo', LARDER_DB_URL: url }),
  );
  try {
    await context.db.sequelize.query('TRUNCATE batches, people RESTART IDENTITY CASCADE');
    await context.db.write(async (transaction) => {
      for (const person of DEMO_PEOPLE) await context.people.add(person, transaction);
    });
  } finally {
    await context.db.close();
    rmSync(dataDir, { recursive: true, force: true });
  }
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const forms = templates();
    await client.query(
      `CREATE TEMPORARY TABLE seed_forms (k INTEGER, id TEXT, title TEXT, kind TEXT,
         revision TEXT, prefix TEXT, result TEXT, nitrite TEXT, ready_days INTEGER)`,
    );
    for (const [k, form] of forms.entries())
      await client.query('INSERT INTO seed_forms VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9)', [
        k,
        form.id,
        form.title,
        form.kind,
        form.revision,
        form.prefix,
        form.result,
        form.nitrite,
        form.readyDays,
      ]);
    const perDay = Math.ceil(rows / 1100);
    const chunk = Math.ceil(CHUNK / perDay) * perDay;
    const recentFrom = rows - RECENT_DAYS * perDay;
    const recent = RECENT_STATUSES.map((status) => `'${status}'`).join(', ');
    for (let first = 0; first < rows; first += chunk) {
      const last = Math.min(rows, first + chunk) - 1;
      // Row i as seed-log.ts writes it: its formula i mod F, its moment day i ÷ perDay plus
      // (i mod perDay) seconds, its sequence the count of its prefix so far that day.
      await client.query(
        `INSERT INTO batches (lot_code, formula_id, formula_revision, formula_title, kind, status,
           operator_id, started_on, ready_on, recorded_at, updated_at, units, inputs, result,
           checks_passed, nitrite_ppm, signed_off_by, signed_off_at, notes)
         SELECT to_char(at, 'YYMMDD') || '-' || f.prefix || '-'
             -- Two digits at least, as lotCode writes them (lpad would cut 100 to "10").
             || CASE WHEN row_number() OVER day_prefix < 10 THEN '0' ELSE '' END
             || (row_number() OVER day_prefix)::text,
           f.id, f.revision, f.title, f.kind, s.status, 1 + i % 3, to_char(at, 'YYYY-MM-DD'),
           to_char(at + f.ready_days * interval '1 day', 'YYYY-MM-DD'), iso, iso, 'metric', '{}',
           f.result, 1, f.nitrite,
           CASE WHEN s.status = 'done' AND i % 3 <> 0 THEN 3 END,
           CASE WHEN s.status = 'done' AND i % 3 <> 0 THEN iso END, NULL
         FROM generate_series($1::integer, $2::integer) i
         JOIN seed_forms f ON f.k = i % $3
         CROSS JOIN LATERAL (SELECT timestamp '2023-12-01' + (i / $4) * interval '1 day'
           + (i % $4) * interval '1 second' AS at) m
         CROSS JOIN LATERAL (SELECT to_char(at, 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"') AS iso) n
         CROSS JOIN LATERAL (SELECT CASE
           WHEN i >= $5 THEN (ARRAY[${recent}])[i % ${RECENT_STATUSES.length} + 1]
           WHEN i % 20 = 0 THEN 'discarded' ELSE 'done' END AS picked) p
         CROSS JOIN LATERAL (SELECT CASE WHEN p.picked = 'curing' AND f.kind <> 'cure'
           THEN CASE WHEN f.kind = 'dough' THEN 'proofing' ELSE 'done' END
           ELSE p.picked END AS status) s
         WINDOW day_prefix AS (PARTITION BY to_char(at, 'YYYY-MM-DD'), f.prefix ORDER BY i)
         ORDER BY i`,
        [first, last, forms.length, perDay, recentFrom],
      );
      log(`\rseeded ${last + 1} of ${rows}`);
    }
    await client.query(
      `INSERT INTO batch_events (batch_id, at, actor_id, type, to_status)
       SELECT id, recorded_at, operator_id, 'recorded', status FROM batches ORDER BY id`,
    );
    await client.query('VACUUM ANALYZE');
    log('\n');
  } finally {
    await client.end();
  }
}
