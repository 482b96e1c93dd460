// Benchmark: 20 concurrent clients recording batches for 10 s; records per second, latency, and a
// check that the database holds exactly as many new batches as the 201s the clients received.
// Each client sends its next request only when the last one was answered, and stops at the
// deadline only between requests, so no request is cut off with its outcome unknown.
// BENCH_DB_URL=postgres://…/db runs it on PostgreSQL instead: on a fresh database of its own beside
// that one (named after it, `…_record`), made before each run and dropped after.
import path from 'node:path';
import pg from 'pg';
import sqlite3 from 'sqlite3';
import { countPostgresBatches } from './seed-log-postgres.ts';
import { settled, signInCookie, startBenchServer } from './server-process.ts';

const CLIENTS = 20;
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
/**
 * Each client records its batches as starting on a day of its own (one of the last 20): a
 * formula has at most 999 lot codes a day, which one shared day would reach within seconds.
 */
function body(clientIndex: number): string {
  const day = new Date(Date.now() - clientIndex * 86_400_000).toISOString().slice(0, 10);
  return JSON.stringify({
    formula: 'quillmoor-belly',
    batch: { meat: '4.26 kg', thickness: '4 cm', start: day },
  });
}

/** Batches in the server's database, read from the file itself (not the API's total). */
function countBatches(databaseFile: string): Promise<number> {
  const db = new sqlite3.Database(databaseFile, sqlite3.OPEN_READONLY);
  return new Promise<number>((resolve, reject) =>
    db.get('SELECT COUNT(*) AS n FROM batches', (error, row: { n: number } | undefined) =>
      error ? reject(error) : resolve(row?.n ?? 0),
    ),
  ).finally(() => db.close());
}

/** A fresh PostgreSQL database beside the one at `url`, and how to drop it. */
async function freshPostgresDatabase(
  url: string,
): Promise<{ url: string; drop: () => Promise<void> }> {
  const given = new URL(url);
  const name = `${given.pathname.slice(1)}_record`;
  const admin = new pg.Client({ connectionString: url });
  await admin.connect();
  const drop = async () =>
    void (await admin.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`));
  await drop();
  await admin.query(`CREATE DATABASE "${name}"`);
  const fresh = new URL(url);
  fresh.pathname = `/${name}`;
  return {
    url: fresh.toString(),
    drop: async () => {
      await drop();
      await admin.end();
    },
  };
}

function percentile(sorted: readonly number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] ?? 0;
}

/** Runs the recording burst and prints it. */
export async function benchRecordBatches(
  processes = 1,
): Promise<{ perSecond: number; consistent: boolean }> {
  const postgres = process.env.BENCH_DB_URL
    ? await freshPostgresDatabase(process.env.BENCH_DB_URL)
    : undefined;
  const server = await startBenchServer({
    LARDER_PROCESSES: String(processes),
    ...(postgres ? { LARDER_DB_URL: postgres.url } : {}),
  });
  // Batches in the server's database, read from the database itself (not the API's total).
  const count = (): Promise<number> =>
    postgres
      ? countPostgresBatches(postgres.url)
      : countBatches(path.join(server.dataDir, 'larderbook.sqlite'));
  try {
    const { cookie, csrf } = await signInCookie(server.url, 'tobin', 'quillmoor-cook');
    const headers = { cookie, 'x-csrf-token': csrf, 'content-type': 'application/json' };
    // The server's own work after a start (the PDF warm-up) stays out of the burst.
    await settled(server);
    const before = await count();
    let acknowledged = 0;
    const refused = new Map<number, number>();
    const times: number[] = [];
    const started = performance.now();
    const deadline = started + SECONDS * 1000;
    const client = async (clientIndex: number): Promise<void> => {
      const requestBody = body(clientIndex);
      while (performance.now() < deadline) {
        const sent = performance.now();
        const response = await fetch(`${server.url}/api/batches`, {
          method: 'POST',
          headers,
          body: requestBody,
        });
        await response.arrayBuffer();
        times.push(performance.now() - sent);
        if (response.status === 201) acknowledged++;
        else refused.set(response.status, (refused.get(response.status) ?? 0) + 1);
      }
    };
    await Promise.all(Array.from({ length: CLIENTS }, (_, i) => client(i)));
    const elapsed = (performance.now() - started) / 1000;
    const stored = (await count()) - before;
    times.sort((a, b) => a - b);
    const perSecond = acknowledged / elapsed;
    const others = [...refused].map(([status, n]) => `${n} × HTTP ${status}`).join(', ') || 'none';
    const rssMb = server.peakRssMb();
    process.stdout.write(
      `Recording batches (${postgres ? 'PostgreSQL, ' : ''}${processes} server process${processes > 1 ? 'es' : ''}, ${CLIENTS} clients, ${SECONDS} s, POST /api/batches)\n` +
        `  ${perSecond.toFixed(0)} records/s, p50 ${percentile(times, 50).toFixed(0)} ms, p99 ${percentile(times, 99).toFixed(0)} ms; other answers: ${others}\n` +
        `  acknowledged (201) ${acknowledged}, new in the database ${stored}: ${stored === acknowledged ? 'equal' : 'DIFFERENT'}\n` +
        `  server peak RSS ${rssMb.toFixed(0)} MB (target ≤ 250 MB)\n`,
    );
    return { perSecond, consistent: stored === acknowledged };
  } finally {
    await server.stop();
    await postgres?.drop();
  }
}
