// Fills a database with a large batch log for the benchmarks: real calculated results of the
// demo formulas, spread over about three years, with a realistic mix of statuses and sign-offs.
// Usage: node --import tsx bench/seed-log.ts DATA_FOLDER [ROWS]
import { cpSync, mkdirSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import sqlite3 from 'sqlite3';
import {
  calculate,
  isFormulaFileName,
  parseBatchOptions,
  presentResult,
  readFormula,
  type RawBatchOptions,
} from '../shared/index.ts';
import { loadConfig } from '../server/config.ts';
import { openContext } from '../server/main-context.ts';
import { formulaInitials, lotCode, lotPrefix } from '../server/batches/lot-code.ts';
import { DEMO_PEOPLE } from '../server/demo/demo-people.ts';

const SAMPLE: Record<string, RawBatchOptions> = {
  cure: { meat: '5 kg', thickness: '4 cm', largestPiece: '2.5 kg' },
  dough: { pieces: '48' },
  blend: { total: '20 kg' },
  mix: { total: '2 kg' },
};
/** The statuses of the last fortnight's batches; every older batch is done, or now and then discarded. */
export const RECENT_STATUSES = [
  'done',
  'done',
  'done',
  'done',
  'done',
  'done',
  'discarded',
  'curing',
  'in-progress',
  'planned',
];
/** Days before the end of the log whose batches can still be under way. */
export const RECENT_DAYS = 14;

/** What changed in how the log is seeded: a log seeded otherwise is seeded again. */
export const SEED_VERSION = '2';

/** A demo formula as seeded batches copy it. */
export interface Template {
  id: string;
  title: string;
  kind: string;
  revision: string;
  prefix: string;
  result: string;
  nitrite: string | null;
  readyDays: number | null;
}

/** One template a demo formula of a kind the log seeds, with its real calculated result. */
export function templates(): Template[] {
  return readdirSync('formulas')
    .filter(isFormulaFileName)
    .flatMap((name) => {
      const text = readFileSync(path.join('formulas', name), 'utf8');
      const formula = readFormula(text, name).formula;
      if (!formula || !(formula.kind in SAMPLE)) return [];
      const result = presentResult(
        calculate(
          formula,
          parseBatchOptions({ ...SAMPLE[formula.kind], start: '2026-01-01' }, formula, {
            today: '2026-01-01',
          }),
        ),
        'metric',
      );
      return [
        {
          id: formula.id,
          title: formula.title,
          kind: formula.kind,
          revision: 'bench'.padEnd(64, '0'),
          prefix: formulaInitials(formula.id),
          result: JSON.stringify(result),
          nitrite: result.checks.find((c) => c.id === 'nitrite-max')?.exact ?? null,
          readyDays: result.schedule?.days ?? null,
        },
      ];
    });
}

function runStatement(statement: sqlite3.Statement, values: unknown[]): Promise<void> {
  return new Promise((resolve, reject) =>
    statement.run(values, (error: Error | null) => (error ? reject(error) : resolve())),
  );
}

function run(db: sqlite3.Database, sql: string): Promise<void> {
  return new Promise((resolve, reject) =>
    db.run(sql, (error) => (error ? reject(error) : resolve())),
  );
}

/** Seeds `rows` batches into a fresh data folder; returns the database file. */
export async function seedLog(
  dataDir: string,
  rows: number,
  log: (text: string) => void = () => {},
): Promise<string> {
  mkdirSync(dataDir, { recursive: true });
  cpSync('formulas', path.join(dataDir, 'formulas'), { recursive: true });
  const config = loadConfig({ LARDER_DATA: dataDir, LARDER_MODE: 'demo' });
  const context = await openContext(config);
  // The demo people only: the batches are this script's.
  await context.db.write(async (transaction) => {
    for (const person of DEMO_PEOPLE) await context.people.add(person, transaction);
  });
  await context.db.close();

  const forms = templates();
  const db = new sqlite3.Database(config.databaseFile);
  // In order: each batch's event names it by id, and ids follow the insertion order.
  db.serialize();
  await run(db, 'PRAGMA synchronous = OFF');
  const insert = db.prepare(
    `INSERT INTO batches (lot_code, formula_id, formula_revision, formula_title, kind, status, operator_id, started_on, ready_on,
       recorded_at, updated_at, units, inputs, result, checks_passed, nitrite_ppm, signed_off_by, signed_off_at, notes)
     VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, 'metric', '{}', ?, 1, ?, ?, ?, NULL)`,
  );
  const event = db.prepare(
    "INSERT INTO batch_events (batch_id, at, actor_id, type, to_status) VALUES (?, ?, ?, 'recorded', ?)",
  );
  const start = Date.UTC(2023, 11, 1);
  const perDay = Math.ceil(rows / 1100);
  const sequence = new Map<string, number>();
  const pending: Promise<void>[] = [];
  await run(db, 'BEGIN');
  for (let i = 0; i < rows; i++) {
    const form = forms[i % forms.length];
    const at = new Date(start + Math.floor((i / perDay) * 86_400_000) + (i % perDay) * 1000);
    const day = at.toISOString().slice(0, 10);
    const key = `${day}${form.prefix}`;
    const n = (sequence.get(key) ?? 0) + 1;
    sequence.set(key, n);
    const lot = lotCode(lotPrefix(day, form.id), n);
    // Like a real log: only recent batches are still planned, under way or curing.
    const recent = rows - 1 - i < RECENT_DAYS * perDay;
    let status = recent
      ? RECENT_STATUSES[i % RECENT_STATUSES.length]
      : i % 20 === 0
        ? 'discarded'
        : 'done';
    if (status === 'curing' && form.kind !== 'cure')
      status = form.kind === 'dough' ? 'proofing' : 'done';
    const ready =
      form.readyDays === null
        ? null
        : new Date(at.getTime() + form.readyDays * 86_400_000).toISOString().slice(0, 10);
    const signed = status === 'done' && i % 3 !== 0;
    const iso = at.toISOString();
    pending.push(
      runStatement(insert, [
        lot,
        form.id,
        form.revision,
        form.title,
        form.kind,
        status,
        1 + (i % 3),
        day,
        ready,
        iso,
        iso,
        form.result,
        form.nitrite,
        signed ? 3 : null,
        signed ? iso : null,
      ]),
      runStatement(event, [i + 1, iso, 1 + (i % 3), status]),
    );
    // Wait for the statements now and then: queued without end, a million of them would hold
    // every result in memory at once.
    if ((i + 1) % 1000 === 0) {
      await Promise.all(pending);
      pending.length = 0;
    }
    if ((i + 1) % 20_000 === 0) {
      await run(db, 'COMMIT');
      await run(db, 'BEGIN');
      log(`\rseeded ${i + 1} of ${rows}`);
    }
  }
  await Promise.all(pending);
  await run(db, 'COMMIT');
  await new Promise((resolve) => insert.finalize(resolve));
  await new Promise((resolve) => event.finalize(resolve));
  await new Promise((resolve) => db.close(resolve));
  writeFileSync(path.join(dataDir, 'seed-version'), `${SEED_VERSION} ${rows}\n`);
  log('\n');
  return config.databaseFile;
}

if (process.argv[1]?.endsWith('seed-log.ts')) {
  const [folder, rows] = process.argv.slice(2);
  if (!folder) throw new Error('usage: seed-log.ts DATA_FOLDER [ROWS]');
  await seedLog(folder, Number(rows ?? 1_000_000), (text) => process.stdout.write(text));
}
