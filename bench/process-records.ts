// Benchmark: process records at scale. A month of a busy kitchen — 1,000 batches of a formula with
// four controls, recorded through the API — with a million readings from data loggers, then:
// logger files through the API, GET /api/batches/:lot/process on a batch with 1,440 readings at
// each control (target p95 ≤ 50 ms), and the HACCP report of the month (target < 5 s), with the
// query plans they rely on. About 1.5 minutes on 2 CPUs; a fresh data folder each run.
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import sqlite3 from 'sqlite3';
import { addDays } from '../shared/calculation/dates.ts';
import { RECORD_READINGS_SQL } from '../server/process/record-readings.ts';
import {
  BATCH_READINGS_SQL,
  LOGGER_SUMMARIES_SQL,
  LOGGER_SUMMARY_SQL,
  PERIOD_BATCHES_SQL,
} from '../server/reports/haccp-queries.ts';
import { CONTROLLED, controlledFormulaYaml } from '../tests/helpers/process-calls.ts';
import { basicAuth, startBenchServer } from './server-process.ts';

const BATCHES = Number(process.env.BENCH_PROCESS_BATCHES ?? 1000);
const REQUESTS = Number(process.env.BENCH_LOG_REQUESTS ?? 100);
const DAYS = 30;
const MINUTE = 60_000;
const COOK = basicAuth('tobin', 'quillmoor-cook');
const REVIEWER = basicAuth('imke', 'quillmoor-review');

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

function run(db: sqlite3.Database, sql: string, values: unknown[] = []): Promise<void> {
  return new Promise((resolve, reject) => db.run(sql, values, (e) => (e ? reject(e) : resolve())));
}

function all<T>(db: sqlite3.Database, sql: string, values: unknown[] = []): Promise<T[]> {
  return new Promise((resolve, reject) =>
    db.all(sql, values, (e, rows) => (e ? reject(e) : resolve(rows as T[]))),
  );
}

/**
 * A batch's logger readings: the smoker chamber every minute for 6 h at 68–72 °C, then the chill
 * every minute for 10 h from 60 °C, T = 2 + 58·e^(−t/70 min), which meets FSIS option 1 (26.7 °C
 * at about 60 min, 4.4 °C at about 223 min). source of the curve: invented for the benchmark
 */
function loggerDay(
  start: number,
  smokerMinutes = 360,
  chillMinutes = 600,
): [string, number, string][] {
  const points: [string, number, string][] = [];
  for (let m = 0; m < smokerMinutes; m++)
    points.push(['smoker', start + m * MINUTE, (70 + 2 * Math.sin(m / 17)).toFixed(1)]);
  const chilled = start + smokerMinutes * MINUTE;
  for (let m = 0; m < chillMinutes; m++)
    points.push(['chill', chilled + m * MINUTE, (2 + 58 * Math.exp(-m / 70)).toFixed(1)]);
  return points;
}

/** Rows written by one INSERT: SQLite takes up to 32,766 values a statement. */
const ROWS_A_STATEMENT = 500;

/**
 * Writes the readings straight into the table (the repository's columns), 500 rows to an INSERT
 * and 50,000 to a transaction.
 */
async function insertReadings(
  db: sqlite3.Database,
  rows: Iterable<[number, string, number, string, string]>,
): Promise<number> {
  let count = 0;
  let values: unknown[] = [];
  const flush = async (): Promise<void> => {
    if (!values.length) return;
    const marks = Array.from({ length: values.length / 6 }, () => '(?, ?, ?, ?, ?, ?)').join(', ');
    await run(
      db,
      `INSERT INTO readings (batch_id, control, taken_at, value, source, recorded_at) VALUES ${marks}`,
      values,
    );
    values = [];
  };
  await run(db, 'BEGIN IMMEDIATE');
  for (const [batch, control, at, value, source] of rows) {
    const iso = new Date(at).toISOString();
    values.push(batch, control, iso, value, source, iso);
    if (++count % ROWS_A_STATEMENT === 0) await flush();
    if (count % 50_000 === 0) {
      await run(db, 'COMMIT');
      await run(db, 'BEGIN IMMEDIATE');
    }
  }
  await flush();
  await run(db, 'COMMIT');
  return count;
}

async function timed(url: string, headers: Record<string, string>, n: number) {
  const times: number[] = [];
  let bytes = 0;
  for (let i = 0; i < n; i++) {
    const started = performance.now();
    const response = await fetch(url, { headers });
    const body = await response.arrayBuffer();
    if (response.status !== 200) throw new Error(`${url}: HTTP ${response.status}`);
    times.push(performance.now() - started);
    bytes = body.byteLength;
  }
  const [first, second] = times;
  times.sort((a, b) => a - b);
  return { p50: percentile(times, 50), p95: percentile(times, 95), first, second, bytes };
}

/** Runs the process records benchmark and prints it. */
export async function benchProcessRecords(): Promise<void> {
  // BENCH_KEEP_DIR=1 keeps the data folder, to profile the report on it afterwards.
  const server = await startBenchServer({}, { keepData: process.env.BENCH_KEEP_DIR === '1' });
  try {
    writeFileSync(
      path.join(server.dataDir, 'formulas', `${CONTROLLED}.yaml`),
      controlledFormulaYaml(),
    );
    const today = new Date().toISOString().slice(0, 10);
    const from = addDays(today, -DAYS);
    const to = addDays(today, -1);
    // 1. A month of batches through the API, started over the 30 days before today.
    let started = performance.now();
    const lots: { lot: string; day: string }[] = [];
    for (let i = 0; i < BATCHES; i++) {
      const day = addDays(from, Math.floor((i * DAYS) / BATCHES));
      const response = await fetch(`${server.url}/api/batches`, {
        method: 'POST',
        headers: { ...COOK, 'content-type': 'application/json', 'x-larder-client': 'bench' },
        body: JSON.stringify({
          formula: CONTROLLED,
          batch: { meat: '4.26kg', thickness: '4cm', start: day },
        }),
      });
      if (response.status !== 201)
        throw new Error(`record: HTTP ${response.status} ${await response.text()}`);
      lots.push({
        lot: ((await response.json()) as { batch: { lotCode: string } }).batch.lotCode,
        day,
      });
    }
    const recordS = (performance.now() - started) / 1000;
    process.stdout.write(`  recorded ${BATCHES} batches in ${recordS.toFixed(1)} s\n`);
    const db = new sqlite3.Database(path.join(server.dataDir, 'larderbook.sqlite'));
    db.configure('busyTimeout', 30_000);
    const ids = new Map(
      (await all<{ id: number; lot_code: string }>(db, 'SELECT id, lot_code FROM batches')).map(
        (r) => [r.lot_code, r.id],
      ),
    );
    // The month's batches are done before their readings are written: the server judges every
    // batch being made each minute (deadlines, alerts), and a scan of a thousand batches
    // caught with their readings half written ran on into the timed requests.
    await run(db, "UPDATE batches SET status = 'done' WHERE formula_id = ?", [CONTROLLED]);
    // 2. A million readings: 960 logger points a batch, and one batch with 1,440 at each control.
    const big = lots[lots.length - 1];
    const bigId = ids.get(big.lot)!;
    function* rows(): Generator<[number, string, number, string, string]> {
      for (const { lot, day } of lots) {
        const id = ids.get(lot)!;
        if (id === bigId) continue;
        const start = Date.parse(`${day}T08:00:00Z`);
        for (const [control, at, value] of loggerDay(start))
          yield [id, control, at, value, 'logger'];
        yield [id, 'cook', start + 300 * MINUTE, '71.5', 'console'];
        yield [id, 'hold', start + 900 * MINUTE, '3.5', 'console'];
      }
      const start = Date.parse(`${big.day}T00:00:00Z`);
      for (const control of ['smoker', 'cook', 'chill', 'hold'])
        for (let m = 0; m < 1440; m++)
          yield [
            bigId,
            control,
            start + m * MINUTE,
            control === 'cook' ? '72' : control === 'hold' ? '3.1' : '70',
            'logger',
          ];
    }
    started = performance.now();
    const inserted = await insertReadings(db, rows());
    const insertS = (performance.now() - started) / 1000;
    // Deviations and releases as a month has them: one batch in 50 missed and was acted on; the rest released.
    await run(db, 'BEGIN IMMEDIATE');
    for (const [i, { lot, day }] of lots.entries()) {
      const id = ids.get(lot)!;
      const at = `${day}T15:00:00.000Z`;
      if (i % 50 === 7) {
        await run(
          db,
          `INSERT INTO deviations (batch_id, control, kind, what, opened_at, dedupe_key) VALUES (?, 'smoker', 'reading', 'Smoker chamber: 82.0 °C (180 °F) at 10:12, above 80 °C', ?, ?)`,
          [id, at, `batch ${id}/smoker/bench`],
        );
        await run(
          db,
          `INSERT INTO corrective_actions (deviation_id, cause, restored, prevention, disposition, recorded_at) VALUES (last_insert_rowid(), 'Damper stuck', 'Damper freed, chamber at 72 °C', 'Damper checked at each start', 'reworked', ?)`,
          [at],
        );
      }
      await run(db, 'INSERT INTO verifications (batch_id, note, recorded_at) VALUES (?, ?, ?)', [
        id,
        'Records reviewed',
        `${day}T20:00:00.000Z`,
      ]);
    }
    await run(db, 'COMMIT');
    await run(db, 'ANALYZE');
    const [{ n }] = await all<{ n: number }>(db, 'SELECT COUNT(*) AS n FROM readings');
    process.stdout.write(
      `Process records: ${BATCHES} batches through POST /api/batches in ${recordS.toFixed(1)} s; ` +
        `${inserted.toLocaleString('en')} readings written straight into the readings table (one prepared INSERT, 50,000 a transaction) ` +
        `in ${insertS.toFixed(1)} s, ${(inserted / insertS).toFixed(0)}/s; ${n.toLocaleString('en')} readings stored\n`,
    );
    // 3. Logger files through the API: a fresh batch, a day's file a control, all or nothing.
    const fresh = await fetch(`${server.url}/api/batches`, {
      method: 'POST',
      headers: { ...COOK, 'content-type': 'application/json', 'x-larder-client': 'bench' },
      body: JSON.stringify({
        formula: CONTROLLED,
        batch: { meat: '4kg', thickness: '4cm', start: to },
      }),
    });
    const freshLot = ((await fresh.json()) as { batch: { lotCode: string } }).batch.lotCode;
    started = performance.now();
    let uploaded = 0;
    for (const control of ['smoker', 'hold']) {
      const lines = Array.from({ length: 1440 }, (_, m) => {
        const at = new Date(Date.parse(`${to}T00:00:00Z`) + m * MINUTE)
          .toISOString()
          .slice(0, 16)
          .replace('T', ' ');
        return `${at},${control === 'smoker' ? '70.5' : '3.2'}`;
      });
      const response = await fetch(
        `${server.url}/api/batches/${freshLot}/readings/upload?control=${control}`,
        {
          method: 'POST',
          headers: { ...COOK, 'content-type': 'text/csv', 'x-larder-client': 'bench' },
          body: `Time,Temp (°C)\n${lines.join('\n')}\n`,
        },
      );
      if (response.status !== 201)
        throw new Error(`upload: HTTP ${response.status} ${await response.text()}`);
      uploaded += ((await response.json()) as { added: number }).added;
    }
    const uploadS = (performance.now() - started) / 1000;
    process.stdout.write(
      `  logger files through POST /api/batches/:lot/readings/upload: ${uploaded} readings in 2 files, ${(uploadS * 500).toFixed(0)} ms a file of 1,440 lines\n`,
    );
    // 4. The query plans, then the process record of the batch with 1,440 readings at each control.
    const start = new Date(`${from}T00:00:00`).toISOString();
    const end = new Date(`${addDays(to, 1)}T00:00:00`).toISOString();
    const plans: [string, string, unknown[]][] = [
      ['process record: its readings', RECORD_READINGS_SQL, [bigId]],
      [
        "report: the period's batches",
        PERIOD_BATCHES_SQL,
        [from, to, ...Array<string[]>(5).fill([start, end]).flat()],
      ],
      [
        'report: readings of a page of batches',
        BATCH_READINGS_SQL([1, 2, 3]),
        [1, 2, 3, 1, 2, 3, 1, 2, 3],
      ],
      ['report: a page of logger summaries', LOGGER_SUMMARIES_SQL(3), [1, 2, 3]],
      [
        'report: an equipment log summed up',
        LOGGER_SUMMARY_SQL('sqlite', 'equipment_id', 1, true),
        [start, end, start, end, 1, start, end],
      ],
    ];
    process.stdout.write('  query plans\n');
    for (const [label, sql, values] of plans) {
      const plan = await all<{ detail: string }>(db, `EXPLAIN QUERY PLAN ${sql}`, values);
      process.stdout.write(`    ${label}: ${plan.map((row) => row.detail).join(' | ')}\n`);
    }
    db.close();
    const recordCpu = server.cpuSeconds();
    const record = await timed(`${server.url}/api/batches/${big.lot}/process`, REVIEWER, REQUESTS);
    // The server's CPU time is steadier than the wall clock on a shared machine.
    const recordCpuMs = ((server.cpuSeconds() - recordCpu) * 1000) / REQUESTS;
    process.stdout.write(
      `  GET /api/batches/:lot/process, 4 controls × 1,440 readings, ${REQUESTS} requests in turn: p50 ${record.p50.toFixed(1)} ms, p95 ${record.p95.toFixed(1)} ms (target p95 ≤ 50 ms); first ${record.first.toFixed(0)} ms; server CPU ${recordCpuMs.toFixed(1)} ms each; ${(record.bytes / 1000).toFixed(0)} kB\n`,
    );
    // 5. The HACCP report of the month, each format twice (the second with warm caches).
    // JSON and CSV first: a PDF that fails (memory) must not hide their figures.
    let ownPeak = false;
    for (const format of ['haccp', 'haccp.csv', 'haccp.pdf']) {
      // The PDF's own peak: the high-water mark starts over before it.
      if (format === 'haccp.pdf') ownPeak = server.resetPeakRss();
      try {
        const url = `${server.url}/api/reports/${format}?from=${from}&to=${to}`;
        const cpu = server.cpuSeconds();
        const report = await timed(url, REVIEWER, 2);
        // The server's CPU time is steadier than the wall clock on a shared machine.
        const cpuEach = (server.cpuSeconds() - cpu) / 2;
        process.stdout.write(
          `  GET /api/reports/${format} for ${from} to ${to} (${BATCHES + 1} batches): ${(report.first / 1000).toFixed(2)} s, then ${(report.second / 1000).toFixed(2)} s (target < 5 s); server CPU ${cpuEach.toFixed(2)} s each; ${(report.bytes / 1e6).toFixed(1)} MB` +
            (format === 'haccp.pdf' && ownPeak
              ? `; server peak RSS while producing it ${server.peakRssMb().toFixed(0)} MB`
              : '') +
            '\n',
        );
      } catch (error) {
        process.stdout.write(
          `  GET /api/reports/${format}: FAILED (${(error as Error).message})\n`,
        );
        break;
      }
    }
    process.stdout.write(
      `  server peak RSS ${server.peakRssMb().toFixed(0)} MB${ownPeak ? ' while producing the PDF' : ''} (target ≤ 250 MB)\n`,
    );
  } finally {
    await server.stop();
  }
}
