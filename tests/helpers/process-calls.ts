import assert from 'node:assert/strict';
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { QueryTypes } from 'sequelize';
import { DeadlineScan } from '../../server/process/deadline-scan.ts';
import type { ProcessRecord } from '../../shared/api/process-record.ts';
import { handClock, type HandClock } from './mail.ts';
import { REPO_ROOT } from './run-larder.ts';
import { startTestServer, type ApiClient, type TestServer } from './test-server.ts';

/** The fixture formula's id: the demo belly, smoked, cooked and chilled under three controls. */
export const CONTROLLED = 'test-cooked-belly';

/**
 * The controls of the fixture, in the order of the work:
 * - smoker: the kitchen's own chamber limit, 60–80 °C (invented for the tests);
 * - cook: 70 °C (158 °F) reached once. source: USDA FSIS, Appendix A, Compliance Guidelines for
 *   Meeting Lethality Performance Standards (1999), instant lethality for meat other than poultry
 * - chill: 130 → 80 °F within 1.5 h, then → 40 °F within 5 h, each stage timed on its own.
 *   source: USDA FSIS, Appendix B, Compliance Guidelines for Cooling Heat-Treated Meat and
 *   Poultry Products (Stabilization) (1999), option 1
 * - hold: at most 41 °F (5 °C). source: FDA Food Code 2022, §3-501.16(A)(2) Cold holding
 */
const CONTROLS = `controls:
  - id: smoker
    title: Smoker chamber
    step: smoke
    measure: chamber-temperature
    limit: { min: 60 °C, max: 80 °C }
    source: Quillmoor smoker validation, 2026
    every: 30 min
  - id: cook
    title: Cooking
    step: smoke
    measure: internal-temperature
    rule: fsis-lethality-instant
  - id: chill
    title: Chilling after the smoke
    step: chill
    measure: internal-temperature
    rule: fsis-cooling-option-1
    every: 30 min
  - id: hold
    title: Cold holding
    step: hold
    measure: internal-temperature
    rule: cold-holding
    every: 4 h
`;

/** The demo belly's text as a formula of its own, with these controls instead of its own. */
export function controlledFormulaYaml(): string {
  const demo = readFileSync(path.join(REPO_ROOT, 'formulas', 'quillmoor-belly.yaml'), 'utf8');
  // Its own controls, with the comment above them: to the next top-level key or the end.
  const belly = demo.replace(/(?:^#.*\n)*^controls:\n(?:[ #].*\n|\n)*/m, '');
  return `${belly
    .replace('id: quillmoor-belly', `id: ${CONTROLLED}`)
    .replace(/^title: .*$/m, 'title: Test belly, smoked, cooked and chilled')}${CONTROLS}`;
}

/** The moment the tests' batches start: the server's clock begins here. */
export const T0 = '2026-03-02T12:00:00.000Z';

/** `minutes` after T0, as ISO. */
export const at = (minutes: number): string =>
  new Date(Date.parse(T0) + minutes * 60_000).toISOString();

/** A test server on a hand clock at T0, with the controlled formula in its folder. */
export async function startProcessServer(t: {
  after(fn: () => unknown): void;
}): Promise<{ server: TestServer; clock: HandClock }> {
  const clock = handClock(new Date(T0));
  const server = await startTestServer(t, {}, { now: clock.now });
  const seeded = new Map<string, number>();
  for (const table of COUNTED_TABLES) seeded.set(table, await maxId(server, table));
  DEMO_ROWS.set(server, seeded);
  writeFileSync(path.join(server.formulasDir, `${CONTROLLED}.yaml`), controlledFormulaYaml());
  server.context.formulas.changed();
  return { server, clock };
}

/** Records a batch of the controlled formula (as planned or in progress) and returns its lot. */
export async function recordControlled(
  client: ApiClient,
  status: 'planned' | 'in-progress' = 'in-progress',
): Promise<string> {
  const response = await client.post('/api/batches', {
    formula: CONTROLLED,
    batch: { meat: '4.26kg', thickness: '4cm', start: T0.slice(0, 10) },
    status,
  });
  assert.equal(response.status, 201, response.text);
  return response.json.batch.lotCode as string;
}

/** Posts a reading and asserts it was taken (201); returns the answer. */
export async function reading(
  client: ApiClient,
  lot: string,
  control: string,
  value: string,
  when?: string,
) {
  const response = await client.post(`/api/batches/${lot}/readings`, {
    control,
    value,
    ...(when ? { at: when } : {}),
  });
  assert.equal(response.status, 201, response.text);
  return response.json;
}

/** Moves a batch along, asserting each move is taken. */
export async function move(client: ApiClient, lot: string, ...statuses: string[]): Promise<void> {
  for (const to of statuses) {
    const response = await client.post(`/api/batches/${lot}/status`, { to });
    assert.equal(response.status, 200, `${to}: ${response.text}`);
  }
}

/** Every control of the fixture within its limit, the cool done in time; the clock after it. */
export async function cleanRun(client: ApiClient, lot: string, clock: HandClock): Promise<void> {
  clock.set(new Date(at(366)));
  // source: the fixture's smoker limit, 60–80 °C (the kitchen's own)
  await reading(client, lot, 'smoker', '72 °C', at(0));
  // source: FSIS Appendix A (1999), 158 °F (70 °C) instant lethality, meat other than poultry
  await reading(client, lot, 'cook', '159 °F', at(1));
  // source: FSIS Appendix B (1999) option 1: 130 → 80 °F within 1.5 h, 80 → 40 °F within 5 h
  await reading(client, lot, 'chill', '130 °F', at(2));
  await reading(client, lot, 'chill', '80 °F', at(80));
  await reading(client, lot, 'chill', '40 °F', at(360));
  // source: FDA Food Code 2022 §3-501.16(A)(2), cold holding at 41 °F or below
  await reading(client, lot, 'hold', '38 °F', at(365));
}

/** A deadline scan on the server's current context (a new one after a restart), on the test's clock. */
export async function scan(server: TestServer, clock: HandClock) {
  const scanner = new DeadlineScan(await server.context.records.processRecords(), server.context, {
    now: clock.now,
  });
  return scanner.runOnce();
}

/** The batch's process record as an admin reads it. */
export async function processOf(server: TestServer, lot: string): Promise<ProcessRecord> {
  const response = await server.as('rosa').get(`/api/batches/${lot}/process`);
  assert.equal(response.status, 200, response.text);
  return response.json as ProcessRecord;
}

/** The tables whose rows the tests count. */
const COUNTED_TABLES = [
  'readings',
  'deviations',
  'corrective_actions',
  'verifications',
  'weighings',
];

/** Per server, the highest row id of each counted table once the demo kitchen was seeded. */
const DEMO_ROWS = new WeakMap<TestServer, ReadonlyMap<string, number>>();

async function maxId(server: TestServer, table: string): Promise<number> {
  const [row] = await server.context.db.sequelize.query<{ n: number | null }>(
    `SELECT MAX(id) AS n FROM ${table}`,
    { type: QueryTypes.SELECT },
  );
  return row?.n ?? 0;
}

/**
 * Rows in a table written since the server started, straight from its database: the demo
 * kitchen's own process records (seeded at the start) are not counted.
 */
export async function rowCount(server: TestServer, table: string): Promise<number> {
  const [row] = await server.context.db.sequelize.query<{ n: number }>(
    `SELECT COUNT(*) AS n FROM ${table} WHERE id > ?`,
    { replacements: [DEMO_ROWS.get(server)?.get(table) ?? 0], type: QueryTypes.SELECT },
  );
  return row!.n;
}

/** A corrective action with the four things 9 CFR 417.3(a) asks, for a rechilled product. */
export const RECHILLED = {
  cause: 'The blast chiller door was left ajar.',
  restored: 'Door closed and gasket checked; chiller back to -2 °C.',
  prevention: 'Door alarm set to sound after 2 minutes open.',
  disposition: 'rechilled',
} as const;
