// Benchmark: the batch log API at a million recorded batches — first page, a filtered page, a page
// deep in the list, a lot-code search (p95 target 10 ms on SQLite), then the console's view and its
// quick filters (30 ms) — p50/p95 of sequential requests, with the query plans the log relies on,
// each page's with a verdict on whether it picks the page's ids before building rows. Reuses
// BENCH_LOG_DIR when it already holds a seeded log.
import { existsSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import sqlite3 from 'sqlite3';
import { parseListQuery } from '../server/batches/batch-query.ts';
import { TOTAL_COUNTED } from '../server/batches/batch-repository.ts';
import { countSql, pageSql } from '../server/batches/batch-sql.ts';
import { logPageCases, type LogPageCase } from './batch-log-cases.ts';
import { benchBatchLogPostgres } from './batch-log-postgres.ts';
import { SEED_VERSION, seedLog } from './seed-log.ts';
import { settled, signInCookie, startBenchServer } from './server-process.ts';

export const ROWS = Number(process.env.BENCH_LOG_ROWS ?? 1_000_000);
export const REQUESTS = Number(process.env.BENCH_LOG_REQUESTS ?? 100);
/** The day the overdue filter counts from, as the console sends it. */
const TODAY = new Date().toLocaleDateString('en-CA');

function all<T>(db: sqlite3.Database, sql: string, values: readonly unknown[] = []): Promise<T[]> {
  return new Promise((resolve, reject) =>
    db.all(sql, values as unknown[], (error, rows) =>
      error ? reject(error) : resolve(rows as T[]),
    ),
  );
}

async function countBatches(databaseFile: string): Promise<number> {
  if (!existsSync(databaseFile)) return 0;
  const db = new sqlite3.Database(databaseFile, sqlite3.OPEN_READONLY);
  try {
    const [{ n }] = await all<{ n: number }>(db, 'SELECT COUNT(*) AS n FROM batches');
    return n;
  } catch {
    return 0; // no batches table: not a seeded log
  } finally {
    db.close();
  }
}

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

interface Timing {
  min: number;
  p50: number;
  p95: number;
  /** The first request, before SQLite's and the disk's caches hold the pages it reads. */
  first: number;
  total: string;
  items: number;
  kb: number;
}

/** Times REQUESTS GETs of a URL in turn. */
export async function time(url: string, headers: Record<string, string>): Promise<Timing> {
  const times: number[] = [];
  let body: ArrayBuffer = new ArrayBuffer(0);
  for (let i = 0; i < REQUESTS; i++) {
    const start = performance.now();
    const response = await fetch(url, { headers });
    body = await response.arrayBuffer();
    if (response.status !== 200) throw new Error(`${url}: HTTP ${response.status}`);
    times.push(performance.now() - start);
  }
  const first = times[0];
  times.sort((a, b) => a - b);
  const page = JSON.parse(Buffer.from(body).toString('utf8')) as {
    items: unknown[];
    total: number;
    totalExact: boolean;
  };
  return {
    min: times[0],
    p50: percentile(times, 50),
    p95: percentile(times, 95),
    first,
    total: `${page.total}${page.totalExact ? '' : '+'}`,
    items: page.items.length,
    kb: body.byteLength / 1000,
  };
}

/**
 * How a page's plan reads: the page's ids and keys picked first (the `page` subquery), by walking
 * an index in order or by sorting them, then the columns built for those rows alone. A plan that
 * sorts after reading the rows builds every match's columns, and slows as the matches grow.
 */
function pageVerdict(plan: string): string {
  const [picked, built] = plan.split(' | SCAN page | ');
  if (built === undefined || !picked.startsWith('CO-ROUTINE page')) return 'NOT PICKED FIRST';
  if (/TEMP B-TREE/.test(built)) return 'SORTS BUILT ROWS';
  return /TEMP B-TREE/.test(picked)
    ? 'sorts ids and keys, builds the page'
    : 'walks an index in order, builds the page';
}

/** Runs the log benchmark and prints it. */
export async function benchBatchLog(): Promise<void> {
  // BENCH_DB_URL: the same pages on PostgreSQL (batch-log-postgres.ts).
  if (process.env.BENCH_DB_URL) return benchBatchLogPostgres(process.env.BENCH_DB_URL);
  const dataDir = process.env.BENCH_LOG_DIR ?? path.join(tmpdir(), `larder-log-${ROWS}`);
  const databaseFile = path.join(dataDir, 'larderbook.sqlite');
  // A log left half-seeded (an interrupted run) or seeded differently is seeded again.
  const seeded = existsSync(path.join(dataDir, 'seed-version'))
    ? readFileSync(path.join(dataDir, 'seed-version'), 'utf8').trim()
    : '';
  if (seeded !== `${SEED_VERSION} ${ROWS}` || (await countBatches(databaseFile)) !== ROWS) {
    rmSync(dataDir, { recursive: true, force: true });
    process.stdout.write(
      `Seeding ${ROWS} batches into ${dataDir} (once, several GB; kept for later runs)…\n`,
    );
    await seedLog(dataDir, ROWS, (text) => process.stdout.write(text));
  }
  // The server first: it brings the log's schema up to date (a new index is built on its first
  // start), and the plans below are the ones it will use.
  const server = await startBenchServer(
    { LARDER_DATA: dataDir, LARDER_FORMULAS: path.join(dataDir, 'formulas') },
    { keepData: true },
  );
  try {
    const db = new sqlite3.Database(databaseFile, sqlite3.OPEN_READONLY);
    const [{ n }] = await all<{ n: number }>(db, 'SELECT COUNT(*) AS n FROM batches');
    const [deep] = await all<{ recorded_at: string; id: number }>(
      db,
      'SELECT recorded_at, id FROM batches ORDER BY recorded_at DESC, id DESC LIMIT 1 OFFSET ?',
      [Math.floor(n / 2)],
    );
    const [lot] = await all<{ lot_code: string }>(db, 'SELECT lot_code FROM batches WHERE id = ?', [
      Math.floor(n / 3),
    ]);
    const lotSearch = lot.lot_code.slice(0, 9);
    const cases: LogPageCase[] = [
      ...logPageCases(deep, lotSearch),
      // The console's log: newest started first, and its quick filters (a reviewer's queue).
      ['console first page (started, desc)', { sort: 'started', order: 'desc', limit: '25' }],
      ['needs sign-off (started, desc)', { needsSignOff: 'true', sort: 'started', limit: '25' }],
      ['failed checks (started, desc)', { checks: 'failed', sort: 'started', limit: '25' }],
      ['overdue (started, desc)', { overdueOn: TODAY, sort: 'started', limit: '25' }],
      // The quick filters in the log's own order (recorded, newest first), as the API defaults.
      ['needs sign-off (recorded, desc)', { needsSignOff: 'true', limit: '25' }],
      ['failed checks (recorded, desc)', { checks: 'failed', limit: '25' }],
      ['overdue (recorded, desc)', { overdueOn: TODAY, limit: '25' }],
    ];

    process.stdout.write(
      `Batch log at ${n} batches: query plans (the page, then its count up to ${TOTAL_COUNTED + 1})\n`,
    );
    for (const [label, params] of cases) {
      const query = parseListQuery(params, true);
      const page = pageSql(query, 'list');
      for (const part of [page, countSql(query.filter, TOTAL_COUNTED)]) {
        const plan = await all<{ detail: string }>(
          db,
          `EXPLAIN QUERY PLAN ${part.sql}`,
          part.values,
        );
        const detail = plan.map((row) => row.detail).join(' | ');
        const verdict = part === page ? ` [${pageVerdict(detail)}]` : '';
        process.stdout.write(`  ${label}: ${detail}${verdict}\n`);
      }
    }
    db.close();

    const { cookie } = await signInCookie(server.url, 'imke', 'quillmoor-review');
    const waited = await settled(server);
    process.stdout.write(
      `Batch log at ${n} batches: GET /api/batches, ${REQUESTS} requests in turn (server settled ${waited.toFixed(1)} s after the plans)\n`,
    );
    for (const [index, [label, params]] of cases.entries()) {
      // The first four are the log's own pages, held to SQLite's target; the console's view and
      // its quick filters to the API's.
      const target = index < 4 ? 10 : 30;
      // The server's CPU (all its threads, SQLite's included) moves less with the machine's load
      // than the times do.
      const cpuBefore = server.cpuSeconds();
      const t = await time(`${server.url}/api/batches?${new URLSearchParams(params)}`, { cookie });
      const cpuMs = ((server.cpuSeconds() - cpuBefore) * 1000) / REQUESTS;
      process.stdout.write(
        `  ${label}: p50 ${t.p50.toFixed(1)} ms, p95 ${t.p95.toFixed(1)} ms (target p95 ≤ ${target} ms); min ${t.min.toFixed(1)} ms, first ${t.first.toFixed(0)} ms; server CPU ${cpuMs.toFixed(1)} ms a request; ` +
          `${t.items} items of ${t.total}, ${t.kb.toFixed(0)} kB\n`,
      );
    }
    process.stdout.write(
      `  server peak RSS ${server.peakRssMb().toFixed(0)} MB (target ≤ 250 MB)\n`,
    );
  } finally {
    await server.stop();
  }
}
