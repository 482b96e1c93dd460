// Benchmark: trace and recall at a million batches and five million lot uses — a forward trace
// from a supplier lot, a backward trace of a batch, the whole recall report as JSON and as PDF —
// p50/p95 over different lots against the one-second target, with the query plans each relies
// on. Runs in this process through the same code the API calls (server/trace), on a database
// seeded once by bench/seed-recall.ts and kept in BENCH_RECALL_DIR for later runs; then the first
// PDF of a fresh server, in a process of its own (bench/recall-fresh.ts).
import { existsSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { AuditRepository } from '../server/audit/audit-repository.ts';
import { openDatabase, type Database } from '../server/db/database.ts';
import { readRows } from '../server/db/read-row.ts';
import { PeopleRepository } from '../server/people/people-repository.ts';
import { produceRecall } from '../server/trace/produce-recall.ts';
import { TRACE_STATEMENTS, fullScans, planOf } from '../server/trace/trace-plans.ts';
import { TraceReader } from '../server/trace/trace-reader.ts';
import { MOST_LEVELS } from '../server/trace/trace-sql.ts';
import { benchFirstRecallPdf } from './recall-fresh.ts';
import { RECALL_SEED_VERSION, seedRecall } from './seed-recall.ts';

const BATCHES = Number(process.env.BENCH_RECALL_BATCHES ?? 1_000_000);
const RUNS = Number(process.env.BENCH_RECALL_RUNS ?? 50);
/** The recall must answer within this, however large the log. */
const TARGET_MS = 1000;

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

/** Times `work` once for each of `inputs`, in turn; returns p50, p95, the first (cold) and a size. */
async function time<T>(
  inputs: readonly T[],
  work: (input: T) => Promise<number>,
): Promise<{ p50: number; p95: number; first: number; max: number; sizes: number[] }> {
  const times: number[] = [];
  const sizes: number[] = [];
  for (const input of inputs) {
    const start = performance.now();
    sizes.push(await work(input));
    times.push(performance.now() - start);
  }
  const first = times[0];
  times.sort((a, b) => a - b);
  return {
    p50: percentile(times, 50),
    p95: percentile(times, 95),
    first,
    max: times[times.length - 1],
    sizes,
  };
}

function line(label: string, t: Awaited<ReturnType<typeof time>>, what: string): string {
  const sorted = [...t.sizes].sort((a, b) => a - b);
  return (
    `  ${label}: p50 ${t.p50.toFixed(1)} ms, p95 ${t.p95.toFixed(1)} ms (target < ${TARGET_MS} ms); ` +
    `first ${t.first.toFixed(0)} ms, max ${t.max.toFixed(0)} ms; ${what} median ${percentile(sorted, 50)}, most ${sorted[sorted.length - 1]}\n`
  );
}

async function seeded(dataDir: string): Promise<boolean> {
  const mark = path.join(dataDir, 'seed-version');
  if (!existsSync(mark)) return false;
  return readFileSync(mark, 'utf8').trim() === `${RECALL_SEED_VERSION} ${BATCHES}`;
}

/**
 * Supplier lots and burger assemblies spread over the log, the same ones on every run; none from
 * its first weeks, where the seed has few lots before them to draw on.
 */
async function samples(db: Database) {
  const step = Math.max(1, Math.floor((BATCHES * 0.15) / RUNS));
  const supplierLots = await readRows<{ supplier_lot: string; supplier: string }>(
    db.sequelize,
    `SELECT supplier_lot, supplier FROM receipts
      WHERE id > (SELECT max(id) FROM receipts) / 20 AND id % ${step * 2} = 1 LIMIT ${RUNS}`,
    [],
  );
  const assemblies = await readRows<{ lot_code: string }>(
    db.sequelize,
    `SELECT lot_code FROM batches
      WHERE id > (SELECT max(id) FROM batches) / 20 AND id % ${step * 10} = 9 LIMIT ${RUNS}`,
    [],
  );
  return { supplierLots, assemblies };
}

/** Runs the recall benchmark and prints it. */
export async function benchRecall(): Promise<void> {
  const dataDir = process.env.BENCH_RECALL_DIR ?? path.join(tmpdir(), `larder-recall-${BATCHES}`);
  if (!(await seeded(dataDir))) {
    rmSync(dataDir, { recursive: true, force: true });
    process.stdout.write(
      `Seeding ${BATCHES} batches into ${dataDir} (once, kept for later runs)…\n`,
    );
    await seedRecall(dataDir, BATCHES, (text) => process.stdout.write(text));
  }
  const db = await openDatabase(path.join(dataDir, 'larderbook.sqlite'));
  let sample: { supplier_lot: string; supplier: string } | undefined;
  try {
    const [counts] = await readRows<{ batches: number; uses: number; receipts: number }>(
      db.sequelize,
      `SELECT (SELECT max(id) FROM batches) AS batches, (SELECT max(id) FROM lot_uses) AS uses,
         (SELECT max(id) FROM receipts) AS receipts`,
      [],
    );
    process.stdout.write(
      `Recall at ${counts.batches} batches, ${counts.uses} lot uses, ${counts.receipts} received lots: query plans\n`,
    );
    for (const statement of TRACE_STATEMENTS) {
      const plan = await planOf(db.sequelize, statement);
      const scans = fullScans(plan);
      process.stdout.write(
        `  ${statement.name}: ${plan.join(' | ')} [${scans.length ? `FULL SCAN: ${scans.join(', ')}` : `index lookups (${statement.indexes.join(', ')})`}]\n`,
      );
    }

    const reader = new TraceReader(db.sequelize);
    const audit = new AuditRepository(db);
    const by = await new PeopleRepository(db).findByUsername('imke');
    if (!by) throw new Error('the seeded records have no imke');
    const { supplierLots, assemblies } = await samples(db);
    process.stdout.write(
      `Recall at ${counts.batches} batches: ${supplierLots.length} supplier lots and ${assemblies.length} burger assemblies in turn (at most ${MOST_LEVELS} levels)\n`,
    );
    const forward = await time(supplierLots, async (s) => {
      const search = { supplierLot: s.supplier_lot, supplier: s.supplier };
      return (await reader.forward(search, await reader.forwardRoots(search))).batches;
    });
    process.stdout.write(line('trace forward from a supplier lot', forward, 'batches reached'));
    const back = await time(assemblies, async (a) => (await reader.back(a.lot_code)).batches);
    process.stdout.write(line('trace back from a burger assembly', back, 'batches behind it'));
    const request = (s: { supplier_lot: string; supplier: string }) => ({
      search: { supplierLot: s.supplier_lot, supplier: s.supplier },
      by,
      kitchen: 'Quillmoor Smokehouse',
      now: new Date(),
    });
    const json = await time(supplierLots, async (s) => {
      const produced = await produceRecall({ db, audit }, 'json', request(s));
      return produced.format === 'json' ? produced.body.totals.batches : 0;
    });
    process.stdout.write(line('recall report of a supplier lot, JSON', json, 'affected batches'));
    const pdf = await time(supplierLots.slice(0, Math.min(20, supplierLots.length)), async (s) => {
      const produced = await produceRecall({ db, audit }, 'pdf', request(s));
      return produced.format === 'pdf' ? Math.round(produced.body.length / 1000) : 0;
    });
    process.stdout.write(line('recall report of a supplier lot, PDF', pdf, 'kB'));
    sample = supplierLots[0];
  } finally {
    await db.close();
  }
  // In a server process of its own: the first PDF of its life, apart from the warm ones above.
  if (sample) await benchFirstRecallPdf(dataDir, sample, TARGET_MS);
}
