// Benchmark: the batch log API at a million recorded batches — first page, a filtered page, a page
// deep in the list, a lot-code search — p50/p95 of sequential requests against the 30 ms target,
// with the query plans the log relies on. Reuses BENCH_LOG_DIR when it already holds a seeded log.
import { existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import sqlite3 from 'sqlite3';
import { encodeCursor, parseListQuery } from '../server/batches/batch-query.ts';
import { countSql, pageSql } from '../server/batches/batch-sql.ts';
import { seedLog } from './seed-log.ts';
import { signInCookie, startBenchServer } from './server-process.ts';

const ROWS = Number(process.env.BENCH_LOG_ROWS ?? 1_000_000);
const REQUESTS = Number(process.env.BENCH_LOG_REQUESTS ?? 100);

function all<T>(db: sqlite3.Database, sql: string, values: readonly unknown[] = []): Promise<T[]> {
  return new Promise((resolve, reject) =>
    db.all(sql, values as unknown[], (error, rows) =>
      error ? reject(error) : resolve(rows as T[]),
    ),
  );
}

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

async function time(
  url: string,
  headers: Record<string, string>,
): Promise<{ p50: number; p95: number }> {
  const times: number[] = [];
  for (let i = 0; i < REQUESTS; i++) {
    const start = performance.now();
    const response = await fetch(url, { headers });
    await response.arrayBuffer();
    if (response.status !== 200) throw new Error(`${url}: HTTP ${response.status}`);
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  return { p50: percentile(times, 50), p95: percentile(times, 95) };
}

/** Runs the log benchmark and prints it. */
export async function benchBatchLog(): Promise<void> {
  const dataDir = process.env.BENCH_LOG_DIR ?? path.join(tmpdir(), `larder-log-${ROWS}`);
  if (!existsSync(path.join(dataDir, 'larderbook.sqlite'))) {
    process.stdout.write(`Seeding ${ROWS} batches into ${dataDir} (once; kept for later runs)…\n`);
    await seedLog(dataDir, ROWS, (text) => process.stdout.write(text));
  }
  const db = new sqlite3.Database(path.join(dataDir, 'larderbook.sqlite'), sqlite3.OPEN_READONLY);
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
  const cases: [string, Record<string, string>][] = [
    ['first page', { limit: '50' }],
    [
      'filtered page (formula + status)',
      { formula: 'quillmoor-belly', status: 'done', limit: '50' },
    ],
    [
      'page deep in the list (half-way)',
      {
        limit: '50',
        cursor: encodeCursor('recorded', 'desc', {
          key: deep.recorded_at,
          id: deep.id,
          direction: 'next',
        }),
      },
    ],
    [`lot-code search (${lotSearch})`, { lot: lotSearch, limit: '50' }],
  ];

  process.stdout.write(`Batch log at ${n} batches: query plans\n`);
  for (const [label, params] of cases) {
    const query = parseListQuery(params, true);
    for (const part of [pageSql(query, true), countSql(query.filter)]) {
      const plan = await all<{ detail: string }>(db, `EXPLAIN QUERY PLAN ${part.sql}`, part.values);
      process.stdout.write(`  ${label}: ${plan.map((row) => row.detail).join(' | ')}\n`);
    }
  }
  db.close();

  const server = await startBenchServer(
    { LARDER_DATA: dataDir, LARDER_FORMULAS: path.join(dataDir, 'formulas') },
    { keepData: true },
  );
  try {
    const { cookie } = await signInCookie(server.url, 'imke', 'quillmoor-review');
    let peakRss = 0;
    for (const [label, params] of cases) {
      const { p50, p95 } = await time(`${server.url}/api/batches?${new URLSearchParams(params)}`, {
        cookie,
      });
      peakRss = Math.max(peakRss, server.rssMb());
      process.stdout.write(
        `  ${label}: p50 ${p50.toFixed(1)} ms, p95 ${p95.toFixed(1)} ms (target p95 ≤ 30 ms) over ${REQUESTS} requests\n`,
      );
    }
    process.stdout.write(`  server RSS ${peakRss.toFixed(0)} MB (target ≤ 250 MB)\n`);
  } finally {
    await server.stop();
  }
}
