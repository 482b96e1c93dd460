import assert from 'node:assert/strict';
import {
  BELLY,
  cookieSession,
  send,
  type Call,
  type CookieSession,
  type Sender,
  type Snapshot,
} from './api-calls.ts';
import { COST_ROUTES } from './cost-routes.ts';
import { EQUIPMENT_ROUTES } from './equipment-routes.ts';
import { PROCESS_ROUTES } from './process-routes.ts';
import { TRACE_ROUTES } from './trace-routes.ts';
import { RECEIPT_ROUTES } from './receipt-routes.ts';
import { WEIGHTS_ROUTES } from './weights-routes.ts';
import { LOT_USE_ROUTES } from './lot-use-routes.ts';
import { PASSWORDS, type ApiResponse, type DemoUser, type TestServer } from './test-server.ts';

/** The callers of the role matrix. */
export type Role = 'anonymous' | 'cook' | 'reviewer' | 'admin';
export const ROLES: readonly Role[] = ['anonymous', 'cook', 'reviewer', 'admin'];
/** The demo person of each role. */
export const USER_OF: Readonly<Record<Exclude<Role, 'anonymous'>, DemoUser>> = {
  cook: 'tobin',
  reviewer: 'imke',
  admin: 'rosa',
};

/** What every route's preparation may use: the server and an admin session for setting up. */
export interface Fixture {
  readonly server: TestServer;
  readonly setup: CookieSession;
}

export async function makeFixture(server: TestServer): Promise<Fixture> {
  return { server, setup: await cookieSession(server, 'rosa') };
}

/** A prepared request, optionally sent by someone other than the role's Basic sign-in. */
export type PreparedCall = Call & { readonly as?: Sender };
type Request = Omit<PreparedCall, 'method'>;

/** One API route with who may use it and how to build a minimal valid request. */
export interface RouteCase {
  readonly method: string;
  readonly route: string;
  /** The signed-in roles that pass the gate; the others get 403. */
  readonly allowed: readonly Role[];
  /** A public route: the status an anonymous request gets (else 401). */
  readonly anonymous?: number;
  /** A session route (sign in, who am I, sign out), left out of the cookie-session runs. */
  readonly sessionRoute?: boolean;
  prepare(fx: Fixture, role: Role): Promise<PreparedCall>;
}

/** A parsed response body (the helper's `any`: tests read any shape). */
type Json = ApiResponse['json'];

let serial = 0;
/** A name no earlier preparation used, for usernames and formula ids. */
const unique = (stem: string): string => `${stem}-${++serial}`;

async function setupCall(fx: Fixture, call: Call): Promise<Json> {
  const response = await send(fx.server, fx.setup, call);
  assert.ok(response.status < 300, `setup ${call.method} ${call.path}: ${response.text}`);
  return response.json;
}

/** A new in-progress batch, which may move to curing and may be signed off. */
const freshLot = async (fx: Fixture): Promise<string> =>
  (await setupCall(fx, { method: 'POST', path: '/api/batches', body: BELLY })).batch.lotCode;

/** A new in-progress batch recorded by the cook, so that the admin and the reviewer may sign it off. */
async function cooksLot(fx: Fixture): Promise<string> {
  const call = { method: 'POST', path: '/api/batches', body: BELLY };
  const response = await send(fx.server, USER_OF.cook, call);
  assert.equal(response.status, 201, `setup ${call.method} ${call.path}: ${response.text}`);
  return response.json.batch.lotCode;
}

/** A new cook, so that changing them touches no one else's cell. */
async function freshPerson(fx: Fixture): Promise<number> {
  const body = {
    username: unique('temp'),
    displayName: 'T',
    role: 'cook',
    password: 'long-enough-1',
  };
  return (await setupCall(fx, { method: 'POST', path: '/api/people', body })).person.id;
}

const formulaNow = (fx: Fixture, id: string): Promise<Json> =>
  setupCall(fx, { method: 'GET', path: `/api/formulas/${id}` });

const smallMix = (id: string): string =>
  `formula: 1\nid: ${id}\ntitle: Matrix mix\nkind: mix\ningredients:\n  - { name: salt, pct: 100, base: true }\n  - { name: pepper, pct: 10 }\n`;

const ALL: readonly Role[] = ['cook', 'reviewer', 'admin'];
const ADMIN: readonly Role[] = ['admin'];

/** A route case; `request` is a fixed path, a fixed request, or built per cell. */
function route(
  method: string,
  template: string,
  allowed: readonly Role[],
  request: string | Request | ((fx: Fixture, role: Role) => Promise<Request>),
  extra: Pick<RouteCase, 'anonymous' | 'sessionRoute'> = {},
): RouteCase {
  const prepare = async (fx: Fixture, role: Role): Promise<PreparedCall> => {
    if (typeof request === 'string') return { method, path: request };
    if (typeof request === 'object') return { method, ...request };
    return { method, ...(await request(fx, role)) };
  };
  return { method, route: template, allowed, prepare, ...extra };
}

const ownPassword = (role: Role): string =>
  PASSWORDS[role === 'anonymous' ? 'tobin' : USER_OF[role]];

/** Every route the API serves (server/app.ts and each router), with a real id or lot. */
export const ROUTES: readonly RouteCase[] = [
  route('GET', '/api/health', ALL, '/api/health', { anonymous: 200 }),
  route(
    'POST',
    '/api/session',
    ALL,
    async (_fx, role) => {
      const username = role === 'anonymous' ? 'tobin' : USER_OF[role];
      return { path: '/api/session', body: { username, password: PASSWORDS[username] } };
    },
    { anonymous: 201, sessionRoute: true },
  ),
  // Who is signed in: read from the session cookie; anonymous is answered 200, signed out.
  route(
    'GET',
    '/api/session',
    ALL,
    async (fx, role) =>
      role === 'anonymous'
        ? { path: '/api/session' }
        : { path: '/api/session', as: await cookieSession(fx.server, USER_OF[role]) },
    { anonymous: 200, sessionRoute: true },
  ),
  // The demo's sign-ins for its sign-in page: anyone may ask, as the page is before sign-in.
  route('GET', '/api/session/demo', ALL, '/api/session/demo', {
    anonymous: 200,
    sessionRoute: true,
  }),
  route('DELETE', '/api/session', ALL, '/api/session', { anonymous: 204, sessionRoute: true }),
  route('POST', '/api/calc', ALL, {
    path: '/api/calc',
    body: { formula: 'brisket-rub', batch: { base: '1kg' } },
  }),
  route('GET', '/api/formulas', ALL, '/api/formulas?kind=cure'),
  route('GET', '/api/formulas/:id', ALL, '/api/formulas/house-sauce'),
  route('GET', '/api/formulas/:id/revisions', ALL, '/api/formulas/house-sauce/revisions'),
  route('GET', '/api/formulas/:id/revisions/:revision', ALL, async (fx) => ({
    path: `/api/formulas/pit-bun/revisions/${(await formulaNow(fx, 'pit-bun')).revision}`,
  })),
  route('GET', '/api/formulas/:id/diff', ALL, async (fx) => ({
    path: `/api/formulas/pit-bun/diff?from=${(await formulaNow(fx, 'pit-bun')).revision}`,
  })),
  route('POST', '/api/formulas/validate', ALL, {
    path: '/api/formulas/validate',
    body: { yaml: smallMix('matrix-check') },
  }),
  route('POST', '/api/formulas/:id/preview', ALL, {
    path: '/api/formulas/brisket-rub/preview',
    body: { batch: { base: '1kg' } },
  }),
  route('PUT', '/api/formulas/:id', ADMIN, async (fx) => {
    const current = await formulaNow(fx, 'house-sauce');
    return {
      path: '/api/formulas/house-sauce',
      body: { yaml: `${current.yaml}# ${unique('matrix save')}\n`, message: 'Matrix save' },
      headers: { 'if-match': `"${current.revision}"` },
    };
  }),
  route('POST', '/api/formulas', ADMIN, async () => ({
    path: '/api/formulas',
    body: { yaml: smallMix(unique('matrix-new')), message: 'Matrix create' },
  })),
  route('POST', '/api/formulas/upload', ADMIN, async () => {
    const form = new FormData();
    form.append('file', new Blob([smallMix(unique('matrix-upload'))]), 'matrix.yaml');
    return { path: '/api/formulas/upload', body: form };
  }),
  route('GET', '/api/batches', ALL, '/api/batches?limit=5'),
  route('GET', '/api/batches.csv', ALL, '/api/batches.csv?kind=cure'),
  route('GET', '/api/batches/:lot', ALL, async (fx) => {
    const page = await setupCall(fx, { method: 'GET', path: '/api/batches?limit=1&sort=lot' });
    return { path: `/api/batches/${page.items[0].lotCode}` };
  }),
  route('POST', '/api/batches', ['cook', 'admin'], { path: '/api/batches', body: BELLY }),
  route('POST', '/api/batches/:lot/status', ['cook', 'admin'], async (fx) => ({
    path: `/api/batches/${await freshLot(fx)}/status`,
    body: { to: 'curing' },
  })),
  route('POST', '/api/batches/:lot/turns', ['cook', 'admin'], async (fx) => {
    const lot = await freshLot(fx);
    await setupCall(fx, {
      method: 'POST',
      path: `/api/batches/${lot}/status`,
      body: { to: 'curing' },
    });
    return { path: `/api/batches/${lot}/turns`, body: { note: 'Turned and rubbed.' } };
  }),
  route('POST', '/api/batches/:lot/sign-off', ['reviewer', 'admin'], async (fx) => ({
    path: `/api/batches/${await cooksLot(fx)}/sign-off`,
    body: { note: 'Checked the sheet.' },
  })),
  // Process records (HACCP): readings, corrections, logger files, corrective actions, release.
  // Before the password routes: a password changed ends the setup's session, which these use.
  ...PROCESS_ROUTES,
  // Weights as weighed, starting a planned batch, refused calculations.
  ...WEIGHTS_ROUTES,
  // What a batch was made from: the lots it used.
  ...LOT_USE_ROUTES,
  ...EQUIPMENT_ROUTES,
  // A plan's pull list against the lots on hand, a month ahead (past every hold of the burger).
  route('GET', '/api/plans/pull-list', ALL, async () => ({
    path: `/api/plans/pull-list?assembly=smokehouse-burger&count=120&for=${new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10)}`,
  })),
  // Trace back and forward, the recall report: every signed-in role.
  ...TRACE_ROUTES,
  ...RECEIPT_ROUTES,
  ...COST_ROUTES,
  route('GET', '/api/people', ADMIN, '/api/people'),
  route('POST', '/api/people', ADMIN, async () => ({
    path: '/api/people',
    body: {
      username: unique('wren'),
      displayName: 'Wren',
      role: 'cook',
      password: 'long-enough-1',
    },
  })),
  route('PATCH', '/api/people/:id', ADMIN, async (fx) => ({
    path: `/api/people/${await freshPerson(fx)}`,
    body: { displayName: 'Renamed' },
  })),
  route('POST', '/api/people/:id/password', ADMIN, async (fx) => ({
    path: `/api/people/${await freshPerson(fx)}/password`,
    body: { password: 'long-enough-2' },
  })),
  // Everyone may change their own password; here to the same one, so later sign-ins still work.
  route('PUT', '/api/people/me/password', ALL, async (_fx, role) => ({
    path: '/api/people/me/password',
    body: { current: ownPassword(role), password: ownPassword(role) },
  })),
  route('GET', '/api/audit', ADMIN, '/api/audit?limit=5'),
  // The HACCP records report, of a day so that the cell stays quick.
  ...['haccp', 'haccp.pdf', 'haccp.csv'].map((name) =>
    route(
      'GET',
      `/api/reports/${name}`,
      ['admin', 'reviewer'],
      `/api/reports/${name}?from=2026-01-05&to=2026-01-05`,
    ),
  ),
];

/** What a cell expects, in words for its test name. */
export function outcomeOf(route: RouteCase, role: Role): string {
  if (role === 'anonymous') return String(route.anonymous ?? 401);
  return route.allowed.includes(role) ? 'allowed (2xx)' : '403';
}

/**
 * Asserts one cell: a signed-in role let through gets a 2xx; one refused gets 403 forbidden;
 * anonymous gets 401 unauthenticated (or a public route's own status). A refused request
 * must leave the stored data exactly as it was.
 */
export function assertCell(
  route: RouteCase,
  role: Role,
  response: ApiResponse,
  stored: { before: Snapshot; after: Snapshot },
): void {
  const what = `${route.method} ${route.route} as ${role}: ${response.status} ${response.text.slice(0, 300)}`;
  if (role === 'anonymous' && route.anonymous !== undefined) {
    assert.equal(response.status, route.anonymous, what);
    return;
  }
  if (role === 'anonymous') {
    assert.equal(response.status, 401, what);
    assert.equal(response.json?.error?.code, 'unauthenticated', what);
  } else if (route.allowed.includes(role)) {
    assert.ok(response.status >= 200 && response.status < 300, what);
    return;
  } else {
    assert.equal(response.status, 403, what);
    assert.equal(response.json?.error?.code, 'forbidden', what);
  }
  assert.deepEqual(stored.after, stored.before, `${what}: a refused request wrote something`);
}
