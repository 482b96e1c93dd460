import assert from 'node:assert/strict';
import { BELLY, send, type Call } from './api-calls.ts';
import type { Fixture, PreparedCall, Role, RouteCase } from './api-routes.ts';

/** A parsed response body (tests read any shape). */
type Json = Awaited<ReturnType<typeof send>>['json'];

const ALL: readonly Role[] = ['cook', 'reviewer', 'admin'];

async function setupCall(fx: Fixture, call: Call): Promise<Json> {
  const response = await send(fx.server, fx.setup, call);
  assert.ok(response.status < 300, `setup ${call.method} ${call.path}: ${response.text}`);
  return response.json;
}

/** A new batch of the demo belly, in progress or planned. */
async function bellyLot(fx: Fixture, status: 'in-progress' | 'planned'): Promise<string> {
  const call = { method: 'POST', path: '/api/batches', body: { ...BELLY, status } };
  return (await setupCall(fx, call)).batch.lotCode;
}

/** A route case whose request is built per cell. */
export function route(
  method: string,
  template: string,
  allowed: readonly Role[],
  prepare: (fx: Fixture) => Promise<Omit<PreparedCall, 'method'>>,
): RouteCase {
  return {
    method,
    route: template,
    allowed,
    prepare: async (fx) => ({ method, ...(await prepare(fx)) }),
  };
}

/** The routes of weights as weighed, starting a planned batch and refused calculations. */
export const WEIGHTS_ROUTES: readonly RouteCase[] = [
  route('POST', '/api/batches/:lot/weighings', ALL, async (fx) => ({
    path: `/api/batches/${await bellyLot(fx, 'in-progress')}/weighings`,
    body: { stage: { name: 'green', weight: '4.26 kg' } },
  })),
  route('POST', '/api/weighings/:id/correction', ALL, async (fx) => {
    const lot = await bellyLot(fx, 'in-progress');
    const weighed = await setupCall(fx, {
      method: 'POST',
      path: `/api/batches/${lot}/weighings`,
      body: { stage: { name: 'green', weight: '4.3 kg' } },
    });
    return {
      path: `/api/weighings/${weighed.weighings[0].id}/correction`,
      body: { weight: '4.26 kg', reason: 'Read off the wrong scale.' },
    };
  }),
  route('POST', '/api/batches/:lot/start', ['cook', 'admin'], async (fx) => ({
    path: `/api/batches/${await bellyLot(fx, 'planned')}/start`,
    body: { batch: BELLY.batch },
  })),
  route('GET', '/api/refusals', ['reviewer', 'admin'], async () => ({ path: '/api/refusals' })),
];
