// The real server as a process of its own, for the fault tests that kill it or take its files away.
import assert from 'node:assert/strict';
import { spawn, type ChildProcess } from 'node:child_process';
import { chmodSync, chownSync, cpSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import pg from 'pg';
import sqlite3 from 'sqlite3';
import { PASSWORDS, type DemoUser } from '../helpers/test-server.ts';
import { REPO_ROOT } from '../helpers/run-larder.ts';
import { testDatabaseEnv, testPostgresUrl } from '../helpers/test-database.ts';

/** The part of a node:test context these helpers need. */
export interface AfterHook {
  after(fn: () => unknown): void;
}

/** A user id and group id to run the server as. */
export interface RunAs {
  readonly uid: number;
  readonly gid: number;
}

/** An unprivileged account every Linux has: what root runs the server as when permissions must count. */
export const NOBODY: RunAs = { uid: 65534, gid: 65534 };

/** A running server process. */
export interface ServerProcess {
  readonly url: string;
  readonly child: ChildProcess;
  /** Everything the process wrote to stdout and stderr so far. */
  output(): string;
  /** Resolves with the exit code (or signal) once the process has ended. */
  readonly exited: Promise<number | NodeJS.Signals | null>;
  /** SIGKILL: no clean-up of any kind, as when the machine's power or the OOM killer ends it. */
  kill(): Promise<void>;
  /** SIGTERM: the server's own clean stop. */
  stop(): Promise<void>;
}

/** A data folder with a copy of the demo formulas, removed when the test ends. */
export function makeDataDir(t: AfterHook, owner?: RunAs): string {
  const dir = mkdtempSync(path.join(tmpdir(), 'larder-fault-'));
  t.after(() => {
    chmodSync(dir, 0o700); // a test may have left it read-only
    rmSync(dir, { recursive: true, force: true });
  });
  cpSync(path.join(REPO_ROOT, 'formulas'), path.join(dir, 'formulas'), { recursive: true });
  if (owner) chownTree(dir, owner);
  return dir;
}

/** Gives a folder and everything in it to another user (root only). */
export function chownTree(dir: string, { uid, gid }: RunAs): void {
  chownSync(dir, uid, gid);
  for (const entry of readdirSync(dir, { withFileTypes: true, recursive: true }))
    chownSync(path.join(entry.parentPath, entry.name), uid, gid);
}

/** The database file of a data folder (LARDER_DB is left at its default). */
export const databaseOf = (dataDir: string): string => path.join(dataDir, 'larderbook.sqlite');

/** The PostgreSQL database settings of each data folder, when the suites run on PostgreSQL. */
const databases = new Map<string, Record<string, string>>();

/**
 * Starts server/main.ts through tsx (the source as it is, nothing to build) in demo mode on a
 * free port over `dataDir`, and waits until it listens (90 s: several processes on a busy machine
 * are slow to start). `as` runs it as another user.
 */
export async function startServerProcess(
  t: AfterHook,
  dataDir: string,
  { env = {}, as }: { env?: Record<string, string>; as?: RunAs } = {},
): Promise<ServerProcess> {
  // The test's own LARDER_* settings (a developer's shell) must not reach the server.
  const inherited = Object.fromEntries(
    Object.entries(process.env).filter(
      ([name]) => !name.startsWith('LARDER_') && !name.startsWith('NODE_TEST'),
    ),
  );
  // On the PostgreSQL cluster of `npm run test:pg`, one database per data folder: a restart on the
  // same folder finds the records it left.
  if (!env.LARDER_DB_URL && testPostgresUrl() && !databases.has(dataDir))
    databases.set(dataDir, await testDatabaseEnv(t));
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
    cwd: REPO_ROOT,
    env: {
      ...inherited,
      LARDER_MODE: 'demo',
      LARDER_DATA: dataDir,
      LARDER_PORT: '0',
      LARDER_CONSOLE: path.join(dataDir, 'no-console'),
      LARDER_SIGN_IN_LIMIT: '10000',
      LARDER_REMINDER_MINUTES: '1440',
      // The demo of one kitchen, as the in-process test servers seed: these tests count every
      // batch in the database against what one site's lists show.
      LARDER_DEMO_SITES: '1',
      ...databases.get(dataDir),
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
    ...(as ? { uid: as.uid, gid: as.gid } : {}),
  });
  let seen = '';
  child.stdout?.on('data', (chunk: Buffer) => (seen += chunk.toString()));
  child.stderr?.on('data', (chunk: Buffer) => (seen += chunk.toString()));
  const exited = new Promise<number | NodeJS.Signals | null>((resolve) =>
    child.once('exit', (code, signal) => resolve(code ?? signal)),
  );
  t.after(async () => {
    if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
    await exited;
  });
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(
      () => reject(new Error(`the server did not listen within 90 s:\n${seen}`)),
      90_000,
    );
    const look = (): void => {
      const match = /at (http:\/\/[\d.]+:\d+)\//.exec(seen);
      if (match) {
        clearTimeout(timer);
        resolve(match[1]);
      }
    };
    child.stdout?.on('data', look);
    void exited.then((code) => {
      clearTimeout(timer);
      reject(new Error(`the server exited (${String(code)}) before listening:\n${seen}`));
    });
  });
  const end = async (signal: NodeJS.Signals): Promise<void> => {
    if (child.exitCode === null && child.signalCode === null) child.kill(signal);
    await exited;
  };
  return {
    url,
    child,
    output: () => seen,
    exited,
    kill: () => end('SIGKILL'),
    stop: () => end('SIGTERM'),
  };
}

/** What one HTTP call answered. */
export interface Answer {
  readonly status: number;
  readonly json: any; // eslint-disable-line @typescript-eslint/no-explicit-any -- tests read any shape
  readonly text: string;
}

/** A console sign-in: its cookie and CSRF token. */
export interface Session {
  readonly cookie: string;
  readonly csrfToken: string;
}

/** Signs in through the form: one password check, however many requests follow. */
export async function signIn(url: string, user: DemoUser): Promise<Session> {
  const response = await fetch(`${url}/api/session`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ username: user, password: PASSWORDS[user] }),
  });
  assert.equal(response.status, 201, `sign-in as ${user}`);
  const { csrfToken } = (await response.json()) as { csrfToken: string };
  return { cookie: (response.headers.get('set-cookie') ?? '').split(';')[0], csrfToken };
}

/**
 * One JSON request as a demo person: over HTTP Basic (a password check per request, as scripts
 * do), or in a session signed in before.
 */
export async function call(
  url: string,
  who: DemoUser | Session,
  method: string,
  route: string,
  body?: unknown,
): Promise<Answer> {
  const headers: Record<string, string> =
    typeof who === 'string'
      ? {
          authorization: `Basic ${Buffer.from(`${who}:${PASSWORDS[who]}`).toString('base64')}`,
          'x-larder-client': 'larder-tests',
        }
      : { cookie: who.cookie, 'x-csrf-token': who.csrfToken };
  if (body !== undefined) headers['content-type'] = 'application/json';
  const response = await fetch(url + route, {
    method,
    headers,
    ...(body === undefined ? {} : { body: JSON.stringify(body) }),
  });
  const text = await response.text();
  let json: unknown;
  try {
    json = text ? JSON.parse(text) : undefined;
  } catch {
    json = undefined;
  }
  return { status: response.status, json, text };
}

/** Runs SQL on a database file through a connection of its own (read-only unless asked). */
export async function query<T = Record<string, unknown>>(
  file: string,
  sql: string,
  { write = false }: { write?: boolean } = {},
): Promise<T[]> {
  const mode = write ? sqlite3.OPEN_READWRITE : sqlite3.OPEN_READONLY;
  const db = await new Promise<sqlite3.Database>((resolve, reject) => {
    const opened = new sqlite3.Database(file, mode, (error) =>
      error ? reject(error) : resolve(opened),
    );
  });
  try {
    return await new Promise<T[]>((resolve, reject) =>
      db.all(sql, (error, rows) => (error ? reject(error) : resolve(rows as T[]))),
    );
  } finally {
    await new Promise<void>((resolve) => db.close(() => resolve()));
  }
}

/**
 * The database's own check that nothing is damaged, 'ok' when nothing is: SQLite's
 * integrity_check of every page and index of the file, or for a postgres:// location amcheck's
 * (postgresIntegrityCheck).
 */
export async function integrityCheck(file: string): Promise<string> {
  if (/^postgres(ql)?:/.test(file)) return postgresIntegrityCheck(file);
  const rows = await query<{ integrity_check: string }>(file, 'PRAGMA integrity_check');
  assert.ok(rows.length > 0);
  return rows.map((row) => row.integrity_check).join('\n');
}

/** Where the database of a data folder is: its PostgreSQL database's URL, or its SQLite file. */
export function databaseLocationOf(dataDir: string): string {
  return databases.get(dataDir)?.LARDER_DB_URL ?? databaseOf(dataDir);
}

/** Runs one statement on a PostgreSQL database through a connection of its own. */
async function postgresQuery<T>(url: string, sql: string): Promise<T[]> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return (await client.query(sql)).rows as T[];
  } finally {
    await client.end();
  }
}

/**
 * Runs a read on the database of a data folder: its PostgreSQL database when the suites run on
 * PostgreSQL, its SQLite file otherwise.
 */
export async function dataQuery<T = Record<string, unknown>>(
  dataDir: string,
  sql: string,
): Promise<T[]> {
  const url = databases.get(dataDir)?.LARDER_DB_URL;
  return url ? postgresQuery<T>(url, sql) : query<T>(databaseOf(dataDir), sql);
}

/**
 * amcheck's check of a PostgreSQL database, 'ok' when nothing is damaged: every table's rows
 * (verify_heapam, its findings listed) and every index against its table (bt_index_check with
 * heapallindexed, which fails on damage).
 */
async function postgresIntegrityCheck(url: string): Promise<string> {
  await postgresQuery(url, 'CREATE EXTENSION IF NOT EXISTS amcheck');
  const damaged = await postgresQuery<{ relname: string; msg: string }>(
    url,
    `SELECT c.relname, v.msg FROM pg_class c
       JOIN pg_namespace n ON n.oid = c.relnamespace AND n.nspname = 'public'
       CROSS JOIN LATERAL verify_heapam(c.oid) v WHERE c.relkind = 'r'`,
  );
  await postgresQuery(
    url,
    `SELECT bt_index_check(c.oid, true) FROM pg_index i
       JOIN pg_class c ON c.oid = i.indexrelid
       JOIN pg_namespace n ON n.oid = c.relnamespace AND n.nspname = 'public'
       JOIN pg_am am ON am.oid = c.relam AND am.amname = 'btree'`,
  );
  return damaged.length ? damaged.map((row) => `${row.relname}: ${row.msg}`).join('\n') : 'ok';
}
