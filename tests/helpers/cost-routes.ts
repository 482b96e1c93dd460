import assert from 'node:assert/strict';
import { BELLY, send } from './api-calls.ts';
import type { Fixture, PreparedCall, Role, RouteCase } from './api-routes.ts';

/** Costs are the managers': admins and reviewers (server/costing/cost-roles.ts), not cooks. */
const MANAGERS: readonly Role[] = ['reviewer', 'admin'];

async function bellyLot(fx: Fixture): Promise<string> {
  const response = await send(fx.server, fx.setup, {
    method: 'POST',
    path: '/api/batches',
    body: BELLY,
  });
  assert.equal(response.status, 201, response.text);
  return response.json.batch.lotCode;
}

function route(
  method: string,
  template: string,
  prepare: (fx: Fixture) => Promise<Omit<PreparedCall, 'method'>>,
): RouteCase {
  return {
    method,
    route: template,
    allowed: MANAGERS,
    prepare: async (fx) => ({ method, ...(await prepare(fx)) }),
  };
}

/** A day a month from now, for a plan that can be made. */
const serviceDay = (): string => new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10);

/** The routes of costs and the least-cost blend. */
export const COST_ROUTES: readonly RouteCase[] = [
  route('GET', '/api/batches/:lot/cost', async (fx) => ({
    path: `/api/batches/${await bellyLot(fx)}/cost`,
  })),
  route('GET', '/api/formulas/:id/costs', async () => ({
    path: '/api/formulas/quillmoor-belly/costs',
  })),
  route('GET', '/api/plans/:assembly/:day/cost', async () => ({
    path: `/api/plans/smokehouse-burger/${serviceDay()}/cost?count=12`,
  })),
  route('GET', '/api/blends/trims', async () => ({ path: '/api/blends/trims' })),
  route('POST', '/api/blends/least-cost', async () => ({
    path: '/api/blends/least-cost',
    body: {
      target: 20,
      batch: '10 kg',
      trims: [
        { name: 'lean', fat: 10, price: 6, onHand: '10 kg' },
        { name: 'fat', fat: 50, price: 2, onHand: '5 kg' },
      ],
    },
  })),
];
