import assert from 'node:assert/strict';
import { before, describe, it } from 'node:test';
import {
  BELLY,
  assertErrorEnvelope,
  cookieSession,
  send,
  snapshot,
  suiteServer,
  type CookieSession,
  type Sender,
} from '../helpers/api-calls.ts';
import { PASSWORDS, type DemoUser, type TestServer } from '../helpers/test-server.ts';

type Body = Record<string, unknown>;

interface Prepared {
  readonly path: string;
  readonly valid: Body;
  readonly headers?: Record<string, string>;
}

interface Setup {
  readonly server: TestServer;
  /** An admin session for preparing fresh lots, people and revisions. */
  readonly admin: CookieSession;
}

/** A route that reads a JSON body, with a valid body and the fields it cannot do without. */
interface BodyRoute {
  readonly method: string;
  readonly route: string;
  readonly as: 'anonymous' | DemoUser;
  readonly required: readonly string[];
  /** Whether `{}` is refused although no field is required (PATCH needs at least one). */
  readonly emptyRefused?: boolean;
  prepare(setup: Setup): Promise<Prepared>;
}

let serial = 0;
const unique = (stem: string): string => `${stem}-${++serial}`;
const MIX = (id: string): string =>
  `formula: 1\nid: ${id}\ntitle: Bad-request mix\nkind: mix\ningredients:\n  - { name: salt, pct: 100, base: true }\n`;

async function setupJson(setup: Setup, method: string, path: string, body?: unknown) {
  const response = await send(setup.server, setup.admin, { method, path, body });
  assert.ok(response.status < 300, response.text);
  return response.json;
}
const freshLot = async (setup: Setup): Promise<string> =>
  (await setupJson(setup, 'POST', '/api/batches', BELLY)).batch.lotCode;
const freshPerson = async (setup: Setup): Promise<number> => {
  const body = { username: unique('temp'), displayName: 'T', role: 'cook' };
  return (await setupJson(setup, 'POST', '/api/people', body)).person.id;
};

/** A body route; `prepare` is a fixed request or one made fresh for each test. */
function route(
  method: string,
  template: string,
  as: BodyRoute['as'],
  required: readonly string[],
  prepare: Prepared | ((setup: Setup) => Promise<Prepared>),
  extra: Pick<BodyRoute, 'emptyRefused'> = {},
): BodyRoute {
  const make = typeof prepare === 'function' ? prepare : async () => prepare;
  return { method, route: template, as, required, prepare: make, ...extra };
}

const ROUTES: readonly BodyRoute[] = [
  route('POST', '/api/session', 'anonymous', ['username', 'password'], {
    path: '/api/session',
    valid: { username: 'tobin', password: PASSWORDS.tobin },
  }),
  route('POST', '/api/calc', 'tobin', ['formula', 'batch'], {
    path: '/api/calc',
    valid: { formula: 'brisket-rub', batch: { base: '1kg' }, units: 'metric' },
  }),
  route('POST', '/api/formulas/validate', 'imke', ['yaml'], {
    path: '/api/formulas/validate',
    valid: { yaml: MIX('checked') },
  }),
  route('POST', '/api/formulas/:id/preview', 'imke', ['batch'], {
    path: '/api/formulas/brisket-rub/preview',
    valid: { yaml: MIX('brisket-rub'), batch: { base: '1kg' }, units: 'us' },
  }),
  route('PUT', '/api/formulas/:id', 'rosa', ['yaml', 'message'], async (setup) => {
    const current = await setupJson(setup, 'GET', '/api/formulas/house-sauce');
    return {
      path: '/api/formulas/house-sauce',
      valid: { yaml: `${current.yaml}# ${unique('edit')}\n`, message: 'Edit' },
      headers: { 'if-match': `"${current.revision}"` },
    };
  }),
  route('POST', '/api/formulas', 'rosa', ['yaml', 'message'], async () => ({
    path: '/api/formulas',
    valid: { yaml: MIX(unique('new-mix')), message: 'New mix' },
  })),
  route('POST', '/api/batches', 'tobin', ['formula', 'batch'], {
    path: '/api/batches',
    valid: { ...BELLY, units: 'metric', status: 'planned', notes: 'Monday bellies' },
  }),
  route('POST', '/api/batches/:lot/status', 'tobin', ['to'], async (setup) => ({
    path: `/api/batches/${await freshLot(setup)}/status`,
    valid: { to: 'curing', reason: 'Into the walk-in' },
  })),
  route('POST', '/api/batches/:lot/turns', 'tobin', [], async (setup) => {
    const lot = await freshLot(setup);
    await setupJson(setup, 'POST', `/api/batches/${lot}/status`, { to: 'curing' });
    return { path: `/api/batches/${lot}/turns`, valid: { note: 'Turned and rubbed' } };
  }),
  route('POST', '/api/batches/:lot/sign-off', 'imke', [], async (setup) => ({
    path: `/api/batches/${await freshLot(setup)}/sign-off`,
    valid: { note: 'Sheet checked' },
  })),
  route('POST', '/api/people', 'rosa', ['username', 'displayName', 'role'], async () => ({
    path: '/api/people',
    valid: {
      username: unique('wren'),
      displayName: 'Wren',
      email: 'wren@quillmoor.invalid',
      role: 'cook',
      password: 'long-enough-1',
    },
  })),
  route(
    'PATCH',
    '/api/people/:id',
    'rosa',
    [],
    async (setup) => ({
      path: `/api/people/${await freshPerson(setup)}`,
      valid: { displayName: 'Renamed', email: null, role: 'reviewer', active: true },
    }),
    { emptyRefused: true },
  ),
  route('POST', '/api/people/:id/password', 'rosa', [], async (setup) => ({
    path: `/api/people/${await freshPerson(setup)}/password`,
    valid: { password: 'long-enough-2' },
  })),
  route('PUT', '/api/people/me/password', 'tobin', ['current', 'password'], {
    path: '/api/people/me/password',
    valid: { current: PASSWORDS.tobin, password: PASSWORDS.tobin },
  }),
];

/** The body with one field (or one field of a nested object) given a value of another type. */
function wrongTypes(valid: Body): Body[] {
  const other = (value: unknown): unknown =>
    typeof value === 'string' || value === null ? 12345 : typeof value === 'number' ? 'x' : 'yes';
  const variants: Body[] = [];
  for (const [key, value] of Object.entries(valid)) {
    if (typeof value === 'object' && value !== null) {
      variants.push({ ...valid, [key]: 'a string' }, { ...valid, [key]: [value] });
      for (const inner of Object.keys(value))
        variants.push({ ...valid, [key]: { ...value, [inner]: other((value as Body)[inner]) } });
    } else variants.push({ ...valid, [key]: other(value) });
  }
  return variants;
}

describe('bad request bodies: a 4xx JSON error and nothing written', () => {
  const server = suiteServer();
  const senders = new Map<string, Sender>([['anonymous', 'anonymous']]);
  let setup: Setup;
  before(async () => {
    setup = { server: server(), admin: await cookieSession(server(), 'rosa') };
    for (const user of ['rosa', 'tobin', 'imke'] as const)
      senders.set(user, await cookieSession(server(), user));
  });

  /** Sends each body in turn; each must be refused with the error envelope, storing nothing. */
  async function refuse(
    route: BodyRoute,
    bodies: readonly unknown[],
    check: (status: number, code: string) => void = () => {},
    contentType = 'application/json',
  ): Promise<void> {
    const sender = senders.get(route.as) ?? 'anonymous';
    for (const body of bodies) {
      const prepared = await route.prepare(setup);
      const before = await snapshot(server());
      const text = typeof body === 'string' ? body : JSON.stringify(body);
      const headers = { ...prepared.headers, 'content-type': contentType };
      const call = { method: route.method, path: prepared.path, body: text, headers };
      const response = await send(server(), sender, call);
      const what = `${route.method} ${prepared.path} ${text.slice(0, 120)}`;
      assertErrorEnvelope(response, what);
      check(response.status, response.json.error.code);
      assert.deepEqual(await snapshot(server()), before, `${what}: something was written`);
    }
  }

  for (const route of ROUTES) {
    describe(`${route.method} ${route.route}`, () => {
      it('should refuse malformed JSON with 400 bad-json', async () => {
        const bodies = ['{"a": ', '{bad}', "{'single': 'quotes'}", '{"a": 1,}', '\u0000'];
        await refuse(route, bodies, (status, code) => {
          assert.equal(status, 400);
          assert.equal(code, 'bad-json');
        });
      });

      it('should refuse a body that is not an object with 400', async () => {
        const bodies = ['[]', '[{}]', '"text"', '42', 'null', 'true'];
        await refuse(route, bodies, (status) => assert.equal(status, 400));
      });

      it('should refuse a body missing a required field', async () => {
        const { valid } = await route.prepare(setup);
        const bodies = route.required.map((key) =>
          Object.fromEntries(Object.entries(valid).filter(([k]) => k !== key)),
        );
        if (route.required.length > 0 || route.emptyRefused) bodies.push({});
        await refuse(route, bodies, (status) => assert.equal(status, 400));
      });

      it('should refuse fields of the wrong type with 400', async () => {
        const { valid } = await route.prepare(setup);
        await refuse(route, wrongTypes(valid), (status) => assert.equal(status, 400));
      });

      it('should refuse unknown fields, __proto__ included, with 400', async () => {
        const { valid } = await route.prepare(setup);
        const json = JSON.stringify(valid);
        const bodies = [
          { ...valid, unexpected: 1 },
          `{"__proto__":{"role":"admin"},${json.slice(1)}`,
          `{"constructor":{"prototype":{"admin":true}},${json.slice(1)}`,
        ];
        await refuse(route, bodies, (status) => assert.equal(status, 400));
      });

      it('should refuse a 2 MB body with 413 too-large', async () => {
        const { valid } = await route.prepare(setup);
        const big = { ...valid, padding: 'x'.repeat(2 * 1024 * 1024) };
        await refuse(route, [big], (status, code) => {
          assert.equal(status, 413);
          assert.equal(code, 'too-large');
        });
      });

      it('should refuse a valid body sent as text, a form or another charset', async () => {
        const { valid } = await route.prepare(setup);
        const json = JSON.stringify(valid);
        await refuse(route, [json], undefined, 'text/plain');
        await refuse(route, ['note=x&to=done'], undefined, 'application/x-www-form-urlencoded');
        await refuse(
          route,
          [json],
          (status) => assert.equal(status, 415),
          'application/json; charset=latin1',
        );
      });

      it('should accept the valid body, so the refusals above were the body’s', async () => {
        const prepared = await route.prepare(setup);
        const sender = senders.get(route.as) ?? 'anonymous';
        const call = { method: route.method, path: prepared.path, body: prepared.valid };
        const response = await send(server(), sender, { ...call, headers: prepared.headers });
        assert.ok(response.status < 300, `${response.status} ${response.text}`);
      });
    });
  }
});
