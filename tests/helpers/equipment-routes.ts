import assert from 'node:assert/strict';
import { send, type Call } from './api-calls.ts';
import type { Fixture, PreparedCall, Role, RouteCase } from './api-routes.ts';

/** A parsed response body (tests read any shape). */
type Json = Awaited<ReturnType<typeof send>>['json'];

let serial = 0;
/** A name no earlier preparation used. */
const unique = (stem: string): string => `${stem} ${++serial}`;

async function setupCall(fx: Fixture, call: Call): Promise<Json> {
  const response = await send(fx.server, fx.setup, call);
  assert.ok(response.status < 300, `setup ${call.method} ${call.path}: ${response.text}`);
  return response.json;
}

/** The id of the demo's equipment with this name. */
async function demoEquipment(fx: Fixture, name: string): Promise<number> {
  const list = await setupCall(fx, { method: 'GET', path: '/api/equipment' });
  const found = (list.equipment as { id: number; name: string }[]).find((e) => e.name === name);
  assert.ok(found, `the demo has ${name}`);
  return found.id;
}

/** A new cooler, so that changing it touches no one else's cell. */
async function freshCooler(fx: Fixture): Promise<number> {
  const body = { name: unique('Matrix cooler'), kind: 'cooler', control: COOLER };
  return (await setupCall(fx, { method: 'POST', path: '/api/equipment', body })).equipment.id;
}

const COOLER = { rule: 'cold-holding', every: '4 h' };
const ALL: readonly Role[] = ['cook', 'reviewer', 'admin'];
const ADMIN: readonly Role[] = ['admin'];

/** A route case whose request is prepared by a function of the fixture. */
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

/** The equipment routes (server/equipment/equipment-router.ts), each with a minimal valid request. */
export const EQUIPMENT_ROUTES: readonly RouteCase[] = [
  route('GET', '/api/equipment', ALL, async () => ({ path: '/api/equipment' })),
  route('POST', '/api/equipment', ADMIN, async () => ({
    path: '/api/equipment',
    body: {
      name: unique('Matrix freezer'),
      kind: 'freezer',
      control: { rule: 'cold-holding', every: '12 h' },
    },
  })),
  route('PATCH', '/api/equipment/:id', ADMIN, async (fx) => ({
    path: `/api/equipment/${await freshCooler(fx)}`,
    body: { name: unique('Renamed cooler') },
  })),
  route('POST', '/api/equipment/:id/readings', ALL, async (fx) => ({
    path: `/api/equipment/${await demoEquipment(fx, 'Walk-in cooler')}/readings`,
    body: { value: '3 °C' },
  })),
  route('POST', '/api/equipment/:id/calibrations', ALL, async (fx) => ({
    path: `/api/equipment/${await demoEquipment(fx, 'Probe thermometer 1')}/calibrations`,
    body: { reading: '0 °C', outcome: 'ok' },
  })),
  route('GET', '/api/equipment/:id/log', ALL, async (fx) => ({
    path: `/api/equipment/${await demoEquipment(fx, 'Walk-in cooler')}/log`,
  })),
];
