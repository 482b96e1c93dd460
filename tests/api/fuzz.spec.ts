import assert from 'node:assert/strict';
import { before, describe, it } from 'node:test';
import fc from 'fast-check';
import { QueryTypes } from 'sequelize';
import {
  assertErrorEnvelope,
  cookieSession,
  send,
  snapshot,
  suiteServer,
  type CookieSession,
  type Sender,
  type Snapshot,
} from '../helpers/api-calls.ts';
import { ROUTES, makeFixture, type Fixture, type RouteCase } from '../helpers/api-routes.ts';
import { EXTRA_ROUTES } from '../helpers/extra-routes.ts';
import type { ApiResponse } from '../helpers/test-server.ts';

/** Every route the API serves. */
const ALL_ROUTES: readonly RouteCase[] = [...ROUTES, ...EXTRA_ROUTES];

/** Tables written by the routes beyond api-calls.ts's TABLES: mail, invitations, reminders, weights. */
const MORE_TABLES = [
  'outbox',
  'invitations',
  'reminder_prefs',
  'reminders_sent',
  'weighings',
  'refusals',
];

/** Tries per route: bodies (routes that take one) and query strings. */
const BODY_RUNS = 8;
const QUERY_RUNS = 3;
/** A PDF takes seconds to make: a valid request is tried once, bodies (mostly refused) twice. */
const PDF_BODY_RUNS = 2;
const PDF_QUERY_RUNS = 1;

/** What the server holds: snapshot() (counts and formula files) and the other tables' counts. */
interface Stored {
  readonly snapshot: Snapshot;
  readonly more: Readonly<Record<string, number>>;
}

type Json = unknown;

/** Values that often break parsers: numbers as text, paths, markup, SQL, odd Unicode. */
const NASTY = [
  '',
  ' ',
  '0',
  '-1',
  '1e309',
  '-0',
  'NaN',
  'Infinity',
  '9'.repeat(400),
  '0x10',
  '4.26.1kg',
  '2024-02-30',
  '../../package.json',
  '..\\..\\x',
  '/etc/passwd',
  '%00',
  '%',
  "' OR 1=1 --",
  '"; DROP TABLE batches; --',
  '<script>alert(1)</script>',
  '{{constructor.constructor("return 1")()}}',
  '__proto__',
  'constructor',
  '\u0000',
  '\ud800',
  '\u202e',
  'ﬀ',
  '𝟘',
  'x'.repeat(5000),
];

const text = fc.oneof(
  fc.string({ maxLength: 30 }),
  fc.string({ unit: 'binary', maxLength: 30 }),
  fc.constantFrom(...NASTY),
);
const anyValue: fc.Arbitrary<Json> = fc.oneof(
  text,
  fc.integer(),
  fc.double(),
  fc.boolean(),
  fc.constant(null),
  fc.jsonValue({ maxDepth: 2 }),
);

type Path = readonly string[];

/** The paths of every value in a JSON object, nested objects and their members both. */
function pathsOf(value: Json, prefix: Path = []): Path[] {
  if (value === null || typeof value !== 'object' || Array.isArray(value)) return [];
  return Object.entries(value).flatMap(([key, item]) => [
    [...prefix, key],
    ...pathsOf(item, [...prefix, key]),
  ]);
}

/** A copy of a JSON value with the value at `path` replaced, or deleted when `value` is absent. */
function changed(body: Json, path: Path, value?: { value: Json }): Json {
  const object = body !== null && typeof body === 'object' && !Array.isArray(body);
  const copy = (object ? structuredClone(body) : {}) as Record<string, Json>;
  let parent = copy;
  for (const key of path.slice(0, -1)) parent = parent[key] as Record<string, Json>;
  const last = path[path.length - 1];
  if (value) Object.defineProperty(parent, last, { value: value.value, enumerable: true });
  else delete parent[last];
  return copy;
}

/**
 * Bodies around a valid one: any JSON at all, text that is not JSON, and the valid body with one
 * value changed to anything, one left out, or one unknown field added (__proto__ among them).
 */
function bodies(valid: Json): fc.Arbitrary<Json | string> {
  const paths = pathsOf(valid);
  const options: fc.Arbitrary<Json | string>[] = [
    fc.jsonValue({ maxDepth: 3 }),
    fc.string({ maxLength: 40 }).map((raw) => `{${raw}`),
    fc
      .record({ key: fc.oneof(text, fc.constant('__proto__')), value: anyValue })
      .map(({ key, value }) => changed(valid, [key], { value })),
  ];
  if (paths.length > 0)
    options.push(
      fc
        .record({ path: fc.constantFrom(...paths), value: anyValue })
        .map(({ path, value }) => changed(valid, path, { value })),
      fc.constantFrom(...paths).map((path) => changed(valid, path)),
    );
  return fc.oneof(...options);
}

/** A formula upload with its field, file name and content varied. */
function uploads(valid: FormData): fc.Arbitrary<FormData> {
  const file = valid.get('file') as File;
  return fc
    .record({
      field: fc.oneof(fc.constant('file'), text),
      name: fc.oneof(
        fc.constantFrom('x.yaml', '../../escape.yaml', '.hidden.yaml', 'a/b.yml'),
        text,
      ),
      content: fc.oneof(
        fc.constant(file),
        fc.string({ unit: 'binary', maxLength: 200 }),
        fc.jsonValue().map((value) => JSON.stringify(value)),
      ),
      extra: fc.option(fc.tuple(text, text), { nil: undefined }),
    })
    .map(({ field, name, content, extra }) => {
      const form = new FormData();
      form.append(field, typeof content === 'string' ? new Blob([content]) : content, name);
      if (extra) form.append(extra[0], extra[1]);
      return form;
    });
}

/** URL-encoded; a lone surrogate, which no URL can carry, becomes U+FFFD as in any browser. */
const encode = (value: string): string =>
  encodeURIComponent(Buffer.from(value, 'utf8').toString('utf8'));

/** The query parameters the API knows somewhere, and any other. */
const QUERY_KEYS = [
  'formula',
  'kind',
  'status',
  'operator',
  'from',
  'to',
  'lot',
  'signedOff',
  'sort',
  'order',
  'limit',
  'cursor',
  'before',
  'action',
];
const queryPart = fc.oneof(
  fc
    .tuple(fc.oneof(fc.constantFrom(...QUERY_KEYS), text), fc.oneof(text, fc.integer().map(String)))
    .map(([key, value]) => `${encode(key)}=${encode(value)}`),
  // Written raw: broken escapes, brackets some parsers read as objects, a key twice.
  fc.constantFrom(
    '%',
    '%zz=1',
    'limit=%E0%A4%A',
    'a[b]=c',
    '__proto__[x]=1',
    'limit=1&limit=2',
    '=',
    '&&',
  ),
);
const queries = fc.array(queryPart, { minLength: 1, maxLength: 4 }).map((parts) => parts.join('&'));

/** Runs a property and fails with its counterexample and the assertion that broke, in words. */
async function assertProperty<T>(
  property: fc.IAsyncPropertyWithHooks<T>,
  numRuns: number,
): Promise<void> {
  const details = await fc.check(property, { numRuns });
  if (details.failed)
    assert.fail(
      `${fc.defaultReportMessage(details) ?? 'the property failed'}\n${String(details.errorInstance)}`,
    );
}

async function stored(server: Fixture['server']): Promise<Stored> {
  const more: Record<string, number> = {};
  for (const table of MORE_TABLES) {
    const [row] = await server.context.db.sequelize.query<{ n: number }>(
      `SELECT COUNT(*) AS n FROM ${table}`,
      { type: QueryTypes.SELECT },
    );
    more[table] = row.n;
  }
  return { snapshot: await snapshot(server), more };
}

/** A 4xx that writes one audit entry on purpose, and nothing else but `table`, if given. */
function auditedOnly(before: Stored, after: Stored, what: string, table?: string): void {
  const strip = (counts: Readonly<Record<string, number>>) => {
    const { audit_events: _audit, ...rest } = counts;
    return rest;
  };
  const without = (more: Readonly<Record<string, number>>) =>
    Object.fromEntries(Object.entries(more).filter(([name]) => name !== table));
  assert.deepEqual(
    {
      ...after,
      more: without(after.more),
      snapshot: { ...after.snapshot, counts: strip(after.snapshot.counts) },
    },
    {
      ...before,
      more: without(before.more),
      snapshot: { ...before.snapshot, counts: strip(before.snapshot.counts) },
    },
    what,
  );
  const written = after.snapshot.counts.audit_events - before.snapshot.counts.audit_events;
  assert.ok(written <= 1, `${what}: one audit entry at most`);
}

/**
 * The two properties: never a 5xx, and a 4xx (with its JSON error) leaves every table and every
 * formula file as it was. Two 4xx write on purpose: a refused sign-in is audited, and a
 * calculation refused over a critical limit is kept as a refusal with its audit entry.
 */
function check(route: RouteCase, response: ApiResponse, before: Stored, after: Stored): void {
  const what = `${route.method} ${route.route}: ${response.status} ${response.text.slice(0, 300)}`;
  assert.ok(response.status < 500, what);
  if (response.status < 400) return;
  assertErrorEnvelope(response, what);
  if (route.route === '/api/session' && response.status === 401)
    return auditedOnly(before, after, what);
  if (response.status === 422 && response.json?.error?.code === 'critical-limit')
    return auditedOnly(before, after, what, 'refusals');
  assert.deepEqual(after, before, `${what}: a refused request wrote something`);
}

describe('fuzzing every route’s body and query: never a 5xx, never a write on a 4xx', () => {
  const server = suiteServer();
  let fx: Fixture;
  let admin: CookieSession;
  let reviewer: CookieSession;
  before(async () => {
    fx = await makeFixture(server());
    admin = await cookieSession(server(), 'rosa');
    // The reviewer changes their own password: a fuzzed body may really change it, and no setup
    // signs in as the reviewer (the cook records the batches that get signed off).
    reviewer = await cookieSession(server(), 'imke');
    // Each formula file's revision is recorded the first time any route reads it, a 4xx or not:
    // bookkeeping of the files, done here once so that it is not taken for a refused write.
    const seen = await send(server(), admin, { method: 'GET', path: '/api/formulas' });
    assert.equal(seen.status, 200, seen.text);
  });

  /**
   * Who sends: nobody for the public routes (a session sent to sign-out would end); the reviewer
   * for their own password (the admin's session is the suite's); the admin, past every role gate,
   * for the rest.
   */
  const senderOf = (route: RouteCase): { sender: Sender; role: 'reviewer' | 'admin' } => {
    if (route.sessionRoute || route.anonymous !== undefined)
      return { sender: 'anonymous', role: 'admin' };
    if (route.route === '/api/people/me/password') return { sender: reviewer, role: 'reviewer' };
    return { sender: admin, role: 'admin' };
  };
  const pdf = (route: RouteCase): boolean => route.route.endsWith('.pdf');

  for (const route of ALL_ROUTES.filter((r) => r.method !== 'GET')) {
    it(`should answer ${route.method} ${route.route} below 500 and write nothing on a 4xx, whatever the body`, async () => {
      const { sender, role } = senderOf(route);
      const base = await route.prepare(fx, role);
      const arbitrary =
        base.body instanceof FormData ? uploads(base.body) : bodies(base.body as Json);
      await assertProperty(
        fc.asyncProperty(arbitrary, async (body) => {
          const before = await stored(server());
          const response = await send(server(), base.as ?? sender, { ...base, body });
          check(route, response, before, await stored(server()));
        }),
        pdf(route) ? PDF_BODY_RUNS : BODY_RUNS,
      );
    });
  }

  for (const route of ALL_ROUTES) {
    it(`should answer ${route.method} ${route.route} below 500 and write nothing on a 4xx, whatever the query`, async () => {
      const { sender, role } = senderOf(route);
      // Prepared once: a request that used up its batch, token or name gets its 4xx, as it should.
      const base = await route.prepare(fx, role);
      await assertProperty(
        fc.asyncProperty(queries, async (query) => {
          const path = `${base.path}${base.path.includes('?') ? '&' : '?'}${query}`;
          const before = await stored(server());
          const response = await send(server(), base.as ?? sender, { ...base, path });
          check(route, response, before, await stored(server()));
        }),
        pdf(route) ? PDF_QUERY_RUNS : QUERY_RUNS,
      );
    });
  }
});
