import { cpSync, mkdtempSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { AppContext } from '../../server/app-context.ts';
import { createApp } from '../../server/app.ts';
import { appServer } from '../../server/http/app-server.ts';
import { closeGracefully, trackRequests } from '../../server/cluster/graceful-close.ts';
import { loadConfig } from '../../server/config.ts';
import { seedDemo } from '../../server/demo/seed-demo.ts';
import { openContext } from '../../server/main-context.ts';
import { REPO_ROOT } from './run-larder.ts';
import { seedableDemo, seededDemoTemplate } from './demo-template.ts';
import { createTestDatabase, testDatabaseEnv, testPostgresUrl } from './test-database.ts';

/** The demo sign-ins the test server starts with. */
export const PASSWORDS = {
  rosa: 'quillmoor-admin',
  tobin: 'quillmoor-cook',
  imke: 'quillmoor-review',
  // The second shop's cook: only on a server started with LARDER_DEMO_SITES '2'.
  maren: 'quillmoor-quay',
} as const;
export type DemoUser = keyof typeof PASSWORDS;

/** A running test server on a temporary database and a copy of the demo formulas. */
export interface TestServer {
  readonly url: string;
  readonly context: AppContext;
  /** The temporary folder: data/, formulas/. */
  readonly dir: string;
  readonly formulasDir: string;
  /**
   * Stops the server and closes its database, then opens a new context on the same file and
   * serves it on the same port: what a restart of the server process does.
   */
  restart(): Promise<void>;
  /** A client that signs every request with HTTP Basic as a demo person (or anonymously). */
  as(user: DemoUser | 'anonymous'): ApiClient;
  /** A client signed in through the form, with its session cookie and CSRF token. */
  signIn(user: DemoUser): Promise<ApiClient>;
}

/** A tiny JSON client over fetch. */
export interface ApiClient {
  request(
    method: string,
    route: string,
    body?: unknown,
    headers?: Record<string, string>,
  ): Promise<ApiResponse>;
  get(route: string, headers?: Record<string, string>): Promise<ApiResponse>;
  post(route: string, body?: unknown, headers?: Record<string, string>): Promise<ApiResponse>;
}

export interface ApiResponse {
  readonly status: number;
  readonly headers: Headers;
  readonly text: string;
  /** The parsed JSON body (undefined when the body is not JSON). */
  readonly json: any; // eslint-disable-line @typescript-eslint/no-explicit-any -- tests read any shape
}

interface AfterHook {
  after(fn: () => unknown): void;
}

async function send(
  url: string,
  method: string,
  body: unknown,
  headers: Record<string, string>,
): Promise<ApiResponse> {
  const init: RequestInit = { method, headers: { ...headers } };
  if (body !== undefined) {
    init.body = typeof body === 'string' ? body : JSON.stringify(body);
    (init.headers as Record<string, string>)['content-type'] ??= 'application/json';
  }
  const response = await fetch(url, init);
  const text = await response.text();
  let json: unknown;
  try {
    json = text ? JSON.parse(text) : undefined;
  } catch {
    json = undefined;
  }
  return { status: response.status, headers: response.headers, text, json };
}

function client(base: string, headers: () => Record<string, string>): ApiClient {
  const request = (
    method: string,
    route: string,
    body?: unknown,
    extra: Record<string, string> = {},
  ): Promise<ApiResponse> => send(base + route, method, body, { ...headers(), ...extra });
  return {
    request,
    get: (route, extra) => request('GET', route, undefined, extra),
    post: (route, body, extra) => request('POST', route, body, extra),
  };
}

/**
 * A server clock whose today (UTC) is `day` at the start of the test and which then runs on at
 * the real pace: for tests whose batches start on fixed days, since a start must lie within a
 * year of the server's today.
 */
export function clockFrom(day: string): () => Date {
  const offset = Date.parse(`${day}T12:00:00Z`) - Date.now();
  return () => new Date(Date.now() + offset);
}

/**
 * The database of a test server: on the PostgreSQL cluster, a copy of the run's seeded demo when
 * the server would seed that very demo (its seed then finds people and does nothing), else a
 * migrated database of its own; on SQLite, none (the file in the server's data folder).
 */
async function serverDatabaseEnv(
  t: AfterHook,
  env: Record<string, string>,
  now: (() => Date) | undefined,
): Promise<Record<string, string>> {
  const adminUrl = testPostgresUrl();
  const demo = seedableDemo(env, now);
  const seeded = adminUrl && demo ? await seededDemoTemplate(adminUrl, demo) : undefined;
  if (adminUrl && seeded) return { LARDER_DB_URL: await createTestDatabase(t, adminUrl, seeded) };
  return testDatabaseEnv(t);
}

/**
 * Starts the real server (createApp over a real SQLite file, or a fresh PostgreSQL database when
 * LARDER_TEST_PG_URL is set) on an ephemeral port, with the demo people and a copy of formulas/,
 * and stops it when the test ends.
 */
export async function startTestServer(
  t: AfterHook,
  env: Record<string, string> = {},
  /** The clock of invitations, reminders and the outbox, for tests that move time. */
  { now }: { now?: () => Date } = {},
): Promise<TestServer> {
  const dir = mkdtempSync(path.join(tmpdir(), 'larder-api-'));
  t.after(() => rmSync(dir, { recursive: true, force: true }));
  const formulasDir = path.join(dir, 'formulas');
  cpSync(path.join(REPO_ROOT, 'formulas'), formulasDir, { recursive: true });
  // On the PostgreSQL cluster of `npm run test:pg`, a database of the test's own; the caller's
  // LARDER_DB_URL (a second server on the same database) wins.
  // Its database is dropped once the server has closed (after hooks run in the order given): a
  // database dropped first ends the connections of jobs still running (57P01).
  const drops: (() => unknown)[] = [];
  const database = env.LARDER_DB_URL
    ? {}
    : await serverDatabaseEnv({ after: (drop) => drops.push(drop) }, env, now);
  const config = loadConfig({
    ...database,
    LARDER_MODE: 'demo',
    LARDER_DATA: path.join(dir, 'data'),
    LARDER_FORMULAS: formulasDir,
    LARDER_CONSOLE: path.join(dir, 'no-console'),
    LARDER_SIGN_IN_LIMIT: '1000',
    // The smokehouse alone, as the suites have always seen it: a test of sites asks for the
    // demo's second shop with LARDER_DEMO_SITES '2' or adds a site of its own.
    LARDER_DEMO_SITES: '1',
    ...env,
  });
  // Opens the database and serves it; a restart does the same again on the same file and port.
  const open = async (port: number) => {
    const context = await openContext(config, now ? { now } : {});
    const server = appServer(createApp(context)).listen(port, '127.0.0.1');
    trackRequests(server);
    await new Promise<void>((resolve) => server.once('listening', () => resolve()));
    context.mail.links.listeningOn((server.address() as AddressInfo).port);
    const close = async (): Promise<void> => {
      // As the server's own stop: requests in flight finish before the database closes, so none
      // of them queries a closed database ("connection manager was closed", SQLITE_MISUSE).
      await closeGracefully(server);
      context.formulas.close();
      await context.mail.close();
      await context.db.close();
    };
    return { context, server, close };
  };
  let running = await open(0).catch(async (error: unknown) => {
    for (const drop of drops) await drop();
    throw error;
  });
  t.after(async () => {
    await running.close();
    for (const drop of drops) await drop();
  });
  await seedDemo(running.context);
  const port = (running.server.address() as AddressInfo).port;
  const url = `http://127.0.0.1:${port}`;

  return {
    url,
    get context() {
      return running.context;
    },
    restart: async () => {
      await running.close();
      running = await open(port);
    },
    dir,
    formulasDir,
    as: (user) =>
      client(url, (): Record<string, string> =>
        user === 'anonymous'
          ? {}
          : {
              authorization: `Basic ${Buffer.from(`${user}:${PASSWORDS[user]}`).toString('base64')}`,
              // A script names itself on password-signed changes (server/auth/basic-writes.ts).
              'x-larder-client': 'larder-tests',
            },
      ),
    signIn: async (user) => {
      const response = await send(
        `${url}/api/session`,
        'POST',
        { username: user, password: PASSWORDS[user] },
        {},
      );
      if (response.status !== 201)
        throw new Error(`sign-in as ${user} failed: ${response.status} ${response.text}`);
      const cookie = (response.headers.get('set-cookie') ?? '').split(';')[0];
      const csrf = response.json.csrfToken as string;
      return client(url, () => ({ cookie, 'x-csrf-token': csrf }));
    },
  };
}
