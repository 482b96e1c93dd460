import assert from 'node:assert/strict';
import { existsSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { send, type Call } from './api-calls.ts';
import type { Fixture, PreparedCall, Role, RouteCase } from './api-routes.ts';
import { CONTROLLED, controlledFormulaYaml } from './process-calls.ts';

/** A parsed response body (tests read any shape). */
type Json = Awaited<ReturnType<typeof send>>['json'];

const ALL: readonly Role[] = ['cook', 'reviewer', 'admin'];

async function setupCall(fx: Fixture, call: Call, as: Fixture['setup'] | 'tobin' = fx.setup) {
  const response = await send(fx.server, as, call);
  assert.ok(response.status < 300, `setup ${call.method} ${call.path}: ${response.text}`);
  return response.json as Json;
}

/** `minutes` before now, as ISO: the suite's server runs on the real clock. */
const ago = (minutes: number): string => new Date(Date.now() - minutes * 60_000).toISOString();

/** A new in-progress batch of the controlled fixture formula, recorded by the admin or the cook. */
async function controlledLot(fx: Fixture, by: 'admin' | 'cook' = 'admin'): Promise<string> {
  const file = path.join(fx.server.formulasDir, `${CONTROLLED}.yaml`);
  if (!existsSync(file)) {
    writeFileSync(file, controlledFormulaYaml());
    fx.server.context.formulas.changed();
  }
  const body = {
    formula: CONTROLLED,
    batch: { meat: '4.26kg', thickness: '4cm', start: ago(0).slice(0, 10) },
  };
  const call = { method: 'POST', path: '/api/batches', body };
  return (await setupCall(fx, call, by === 'cook' ? 'tobin' : fx.setup)).batch.lotCode;
}

async function addReading(fx: Fixture, lot: string, control: string, value: string, at: string) {
  const call = {
    method: 'POST',
    path: `/api/batches/${lot}/readings`,
    body: { control, value, at },
  };
  return setupCall(fx, call);
}

/** A batch recorded by the cook, every control met in time, marked done: ready for release. */
async function finishedLot(fx: Fixture): Promise<string> {
  const lot = await controlledLot(fx, 'cook');
  // source: FSIS Appendix A (1999), 158 °F instant lethality; Appendix B (1999) option 1, 130 →
  // 80 °F within 1.5 h and → 40 °F within 5 h; FDA Food Code 2022 §3-501.16(A)(2), 41 °F or below
  // Entered in order, each before any deadline it starts has passed, as a cook enters them.
  const log: [string, string, number][] = [
    ['smoker', '72 °C', 210],
    ['cook', '159 °F', 205],
    ['chill', '130 °F', 200],
    ['chill', '80 °F', 150],
    ['chill', '40 °F', 10],
    ['hold', '38 °F', 5],
  ];
  for (const [control, value, minutes] of log)
    await addReading(fx, lot, control, value, ago(minutes));
  for (const to of ['curing', 'done'])
    await setupCall(fx, { method: 'POST', path: `/api/batches/${lot}/status`, body: { to } });
  return lot;
}

function processRoute(
  method: string,
  route: string,
  allowed: readonly Role[],
  prepare: (fx: Fixture) => Promise<Omit<PreparedCall, 'method'>>,
): RouteCase {
  return { method, route, allowed, prepare: async (fx) => ({ method, ...(await prepare(fx)) }) };
}

/** The routes of batches' process records, each with a minimal valid request. */
export const PROCESS_ROUTES: readonly RouteCase[] = [
  processRoute('GET', '/api/batches/:lot/process', ALL, async (fx) => ({
    path: `/api/batches/${await controlledLot(fx)}/process`,
  })),
  processRoute('POST', '/api/batches/:lot/readings', ALL, async (fx) => ({
    path: `/api/batches/${await controlledLot(fx)}/readings`,
    body: { control: 'smoker', value: '70 °C' },
  })),
  processRoute('POST', '/api/batches/:lot/readings/upload', ALL, async (fx) => ({
    path: `/api/batches/${await controlledLot(fx)}/readings/upload?control=smoker`,
    body: `Timestamp,Temperature (°C)\n${ago(2)},70\n${ago(1)},71\n`,
    headers: { 'content-type': 'text/csv' },
  })),
  processRoute('POST', '/api/readings/:id/correction', ALL, async (fx) => {
    const lot = await controlledLot(fx);
    const { reading } = await addReading(fx, lot, 'smoker', '17 °C', ago(1));
    return {
      path: `/api/readings/${reading.id}/correction`,
      body: { value: '71 °C', reason: 'Typed 17 for 71.' },
    };
  }),
  processRoute('POST', '/api/deviations/:id/action', ALL, async (fx) => {
    const lot = await controlledLot(fx);
    const { deviation } = await addReading(fx, lot, 'hold', '50 °F', ago(1));
    return {
      path: `/api/deviations/${deviation.id}/action`,
      body: {
        cause: 'Walk-in door left open.',
        restored: 'Door shut; walk-in back to 3 °C.',
        prevention: 'Door alarm fitted.',
        disposition: 'rechilled',
      },
    };
  }),
  processRoute('POST', '/api/batches/:lot/verify', ['reviewer', 'admin'], async (fx) => ({
    path: `/api/batches/${await finishedLot(fx)}/verify`,
    body: { note: 'Records reviewed.' },
  })),
  processRoute('GET', '/api/process/now', ALL, async () => ({ path: '/api/process/now' })),
];
