import assert from 'node:assert/strict';
import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { after, before } from 'node:test';
import { QueryTypes } from 'sequelize';
import {
  PASSWORDS,
  startTestServer,
  type ApiResponse,
  type DemoUser,
  type TestServer,
} from './test-server.ts';

/** A console sign-in as raw parts, so a test can leave the CSRF token out on purpose. */
export interface CookieSession {
  readonly user: DemoUser;
  readonly cookie: string;
  readonly csrfToken: string;
}

/** Who sends a request: nobody, a demo person over HTTP Basic, or a cookie session. */
export type Sender = 'anonymous' | DemoUser | CookieSession;

/** One HTTP request: a JSON value (or raw string, or FormData) as the body. */
export interface Call {
  readonly method: string;
  readonly path: string;
  readonly body?: unknown;
  readonly headers?: Readonly<Record<string, string>>;
}

/**
 * Starts one test server for a describe block (before) and stops it after the block; the
 * returned function gives the running server inside the tests.
 */
export function suiteServer(): () => TestServer {
  let server: TestServer | undefined;
  const stops: (() => unknown)[] = [];
  before(async () => {
    server = await startTestServer({ after: (fn) => void stops.push(fn) });
  });
  after(async () => {
    for (const stop of stops.reverse()) await stop();
  });
  return () => {
    assert.ok(server, 'the suite server did not start');
    return server;
  };
}

/** Signs in through POST /api/session and keeps the cookie and token apart. */
export async function cookieSession(server: TestServer, user: DemoUser): Promise<CookieSession> {
  const response = await fetch(`${server.url}/api/session`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ username: user, password: PASSWORDS[user] }),
  });
  assert.equal(response.status, 201, `sign-in as ${user}`);
  const cookie = (response.headers.get('set-cookie') ?? '').split(';')[0];
  const { csrfToken } = (await response.json()) as { csrfToken: string };
  return { user, cookie, csrfToken };
}

/** Sends a call as someone; `csrf: false` leaves the X-CSRF-Token header off a cookie request. */
export async function send(
  server: TestServer,
  sender: Sender,
  call: Call,
  { csrf = true }: { csrf?: boolean } = {},
): Promise<ApiResponse> {
  const headers: Record<string, string> = {};
  if (typeof sender === 'object') {
    headers.cookie = sender.cookie;
    if (csrf) headers['x-csrf-token'] = sender.csrfToken;
  } else if (sender !== 'anonymous') {
    const pair = `${sender}:${PASSWORDS[sender]}`;
    headers.authorization = `Basic ${Buffer.from(pair).toString('base64')}`;
    // A password-signed change must name its script (server/auth/basic-writes.ts), as larder does.
    headers['x-larder-client'] = 'larder-tests';
  }
  let body: string | FormData | undefined;
  if (call.body instanceof FormData || typeof call.body === 'string') body = call.body;
  else if (call.body !== undefined) body = JSON.stringify(call.body);
  if (body !== undefined && !(body instanceof FormData))
    headers['content-type'] = 'application/json';
  Object.assign(headers, call.headers);
  const response = await fetch(server.url + call.path, { method: call.method, headers, body });
  const text = await response.text();
  let json: unknown;
  try {
    json = text ? JSON.parse(text) : undefined;
  } catch {
    json = undefined;
  }
  return { status: response.status, headers: response.headers, text, json };
}

/** The tables every write touches; a refused request must leave each count as it was. */
export const TABLES = [
  'batches',
  'batch_events',
  'batch_turns',
  'people',
  'audit_events',
  'formula_revisions',
  'lot_uses',
  'receipts',
];

/** What the server has stored: row counts per table and every file of the formulas folder. */
export interface Snapshot {
  readonly counts: Readonly<Record<string, number>>;
  readonly files: Readonly<Record<string, string>>;
}

/** Reads the database counts and the formulas folder, straight from the server's storage. */
export async function snapshot(server: TestServer): Promise<Snapshot> {
  const counts: Record<string, number> = {};
  for (const table of TABLES) {
    const [row] = await server.context.db.sequelize.query<{ n: number }>(
      `SELECT COUNT(*) AS n FROM ${table}`,
      { type: QueryTypes.SELECT },
    );
    counts[table] = row.n;
  }
  const files: Record<string, string> = {};
  // Every file, left-over temporary files (.NAME.tmp) included.
  for (const entry of readdirSync(server.formulasDir, { withFileTypes: true }))
    if (entry.isFile())
      files[entry.name] = readFileSync(path.join(server.formulasDir, entry.name), 'utf8');
  return { counts, files };
}

/** The batches and their events: what recording writes (reading a formula may note its revision). */
export async function batchCounts(server: TestServer): Promise<[number, number]> {
  const { counts } = await snapshot(server);
  return [counts.batches, counts.batch_events];
}

/** Asserts the JSON error envelope `{ error: { code, message, details } }` of a 4xx. */
export function assertErrorEnvelope(response: ApiResponse, what: string): void {
  assert.ok(response.status >= 400 && response.status < 500, `${what}: ${response.status}`);
  assert.match(response.headers.get('content-type') ?? '', /^application\/json/, what);
  const error = response.json?.error;
  assert.equal(typeof error?.code, 'string', `${what}: ${response.text}`);
  assert.equal(typeof error?.message, 'string', `${what}: ${response.text}`);
  assert.ok(error.message.length > 0, what);
}

/**
 * A dry-cure batch of the demo belly, started today (UTC, as the server counts it): servers in
 * processes of their own run on the real clock, and a start must lie within a year of it.
 */
export const BELLY = {
  formula: 'quillmoor-belly',
  batch: { meat: '4.26kg', thickness: '4cm', start: new Date().toISOString().slice(0, 10) },
} as const;
