// Benchmark: the batch log's four pages (first, formula + status, half-way, lot-code search) on
// PostgreSQL, p50/p95 of sequential requests (target p95 ≤ 30 ms at a million batches), with the
// plan of each page and its capped count and whether it scans the batches table. Runs when
// BENCH_DB_URL names a database the benchmark may fill: it is seeded with BENCH_LOG_ROWS batches
// (emptied first) unless it holds that many already.
import { mkdtempSync, cpSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { parseListQuery } from '../server/batches/batch-query.ts';
import { TOTAL_COUNTED } from '../server/batches/batch-repository.ts';
import { countSql, pageSql } from '../server/batches/batch-sql.ts';
import { numberedParameters } from '../server/db/postgres-read.ts';
import { logPageCases } from './batch-log-cases.ts';
import { REQUESTS, ROWS, time } from './batch-log.ts';
import { countPostgresBatches, seedPostgresLog } from './seed-log-postgres.ts';
import { settled, signInCookie, startBenchServer } from './server-process.ts';

/** A node of EXPLAIN (FORMAT JSON)'s plan tree. */
interface PlanNode {
  'Node Type': string;
  'Relation Name'?: string;
  'Index Name'?: string;
  Plans?: PlanNode[];
}

/** A plan's scans in a line: "Index Scan batches_recorded_order", "Seq Scan batches". */
function scansOf(node: PlanNode): string[] {
  const own = /Scan/.test(node['Node Type'])
    ? [`${node['Node Type']} ${node['Index Name'] ?? node['Relation Name'] ?? ''}`.trim()]
    : [];
  return [...own, ...(node.Plans ?? []).flatMap(scansOf)];
}

/** Runs the log benchmark on the PostgreSQL database at `url` and prints it. */
export async function benchBatchLogPostgres(url: string): Promise<void> {
  if ((await countPostgresBatches(url)) !== ROWS) {
    process.stdout.write(`Seeding ${ROWS} batches into PostgreSQL (kept for later runs)…\n`);
    await seedPostgresLog(url, ROWS, (text) => process.stdout.write(text));
  }
  const dataDir = mkdtempSync(path.join(tmpdir(), 'larder-log-pg-'));
  cpSync('formulas', path.join(dataDir, 'formulas'), { recursive: true });
  const server = await startBenchServer({ LARDER_DATA: dataDir, LARDER_DB_URL: url });
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const { rows: counted } = await client.query<{ n: string }>(
      'SELECT COUNT(*) AS n FROM batches',
    );
    const n = Number(counted[0].n);
    const { rows: deep } = await client.query<{ recorded_at: string; id: number }>(
      'SELECT recorded_at, id FROM batches ORDER BY recorded_at DESC, id DESC LIMIT 1 OFFSET $1',
      [Math.floor(n / 2)],
    );
    const { rows: lot } = await client.query<{ lot_code: string }>(
      'SELECT lot_code FROM batches WHERE id = $1',
      [Math.floor(n / 3)],
    );
    const lotSearch = lot[0].lot_code.slice(0, 9);
    const cases = logPageCases(deep[0], lotSearch);
    process.stdout.write(
      `Batch log on PostgreSQL at ${n} batches: the scans of each plan (the page, then its count up to ${TOTAL_COUNTED + 1})\n`,
    );
    for (const [label, params] of cases) {
      const query = parseListQuery(params, true);
      for (const part of [
        pageSql(query, 'list', 'postgres'),
        countSql(query.filter, TOTAL_COUNTED, 'postgres'),
      ]) {
        const { rows } = await client.query<{ 'QUERY PLAN': { Plan: PlanNode }[] }>(
          `EXPLAIN (FORMAT JSON) ${numberedParameters(part.sql)}`,
          [...part.values],
        );
        const scans = scansOf(rows[0]['QUERY PLAN'][0].Plan);
        const verdict = scans.includes('Seq Scan batches') ? ' [SCANS BATCHES]' : '';
        process.stdout.write(`  ${label}: ${scans.join(', ')}${verdict}\n`);
      }
    }

    const { cookie } = await signInCookie(server.url, 'imke', 'quillmoor-review');
    const waited = await settled(server);
    process.stdout.write(
      `Batch log on PostgreSQL at ${n} batches: GET /api/batches, ${REQUESTS} requests in turn (server settled ${waited.toFixed(1)} s)\n`,
    );
    for (const [label, params] of cases) {
      const t = await time(`${server.url}/api/batches?${new URLSearchParams(params)}`, { cookie });
      process.stdout.write(
        `  ${label}: p50 ${t.p50.toFixed(1)} ms, p95 ${t.p95.toFixed(1)} ms (target p95 ≤ 30 ms); min ${t.min.toFixed(1)} ms, first ${t.first.toFixed(0)} ms; ` +
          `${t.items} items of ${t.total}, ${t.kb.toFixed(0)} kB\n`,
      );
    }
  } finally {
    await client.end();
    await server.stop();
    rmSync(dataDir, { recursive: true, force: true });
  }
}
