// A fresh PostgreSQL database for each test server when LARDER_TEST_PG_URL names a cluster
// (`npm run test:pg` starts a throw-away one); nothing at all when it is not set (SQLite).
import { randomBytes } from 'node:crypto';
import { after } from 'node:test';
import pg from 'pg';
import { openDatabase } from '../../server/db/database.ts';

/** The part of a node:test context these helpers need. */
interface AfterHook {
  after(fn: () => unknown): void;
}

/** The admin URL of the PostgreSQL cluster the suites run against, or undefined for SQLite. */
export function testPostgresUrl(): string | undefined {
  return process.env.LARDER_TEST_PG_URL || undefined;
}

/** Runs one statement as the cluster's admin, on a connection of its own. */
async function asAdmin(adminUrl: string, sql: string): Promise<void> {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

/** The URL of database `name` on the cluster of `adminUrl`. */
export function databaseUrl(adminUrl: string, name: string): string {
  const url = new URL(adminUrl);
  url.pathname = `/${name}`;
  return url.toString();
}

/**
 * Creates a database with a random name on the test cluster, empty or copied from `template`,
 * and drops it when the test ends (its connections ended first, WITH FORCE); returns its URL.
 */
export async function createTestDatabase(
  t: AfterHook,
  adminUrl: string,
  template?: string,
): Promise<string> {
  const name = `larder_test_${randomBytes(6).toString('hex')}`;
  await asAdmin(adminUrl, `CREATE DATABASE ${name}${template ? ` TEMPLATE ${template}` : ''}`);
  t.after(() => asAdmin(adminUrl, `DROP DATABASE IF EXISTS ${name} WITH (FORCE)`));
  return databaseUrl(adminUrl, name);
}

/**
 * Creates an EMPTY database (no tables, nothing migrated) on the test cluster, dropped when the
 * test ends; returns its URL. For the specs of the migrations themselves, which migrate it to a
 * step of their choosing, and for any test whose migrations must see settings of its own
 * (LARDER_KITCHEN names the first site in migration 021).
 */
export async function freshPostgresDatabase(t: AfterHook, adminUrl: string): Promise<string> {
  return createTestDatabase(t, adminUrl);
}

/**
 * The migrated database test databases are copied from, when the run names one
 * (LARDER_TEST_PG_TEMPLATE: `npm run test:pg` gives a new name each run and drops it at the end).
 */
export function testPostgresTemplate(): string | undefined {
  const name = process.env.LARDER_TEST_PG_TEMPLATE || undefined;
  // It is written into statements as it is: only a plain lower-case name will do.
  if (name !== undefined && !/^[a-z_][a-z0-9_]{0,62}$/.test(name))
    throw new Error(`LARDER_TEST_PG_TEMPLATE must be a plain lower-case name, not ${name}`);
  return name;
}

/**
 * For a spec of the templates run alone (no `npm run test:pg` around it): names a template of the
 * spec's own, and drops it and the demos seeded from it when the suite ends. Call it inside the
 * suite's describe; under `npm run test:pg` the spec copies the run's template, as every other.
 */
export function ownTemplateWhenAlone(adminUrl: string): void {
  if (testPostgresTemplate()) return;
  const name = `larder_template_${randomBytes(6).toString('hex')}`;
  process.env.LARDER_TEST_PG_TEMPLATE = name;
  after(async () => {
    delete process.env.LARDER_TEST_PG_TEMPLATE;
    const admin = new pg.Client({ connectionString: adminUrl });
    await admin.connect();
    try {
      const { rows } = await admin.query<{ datname: string }>(
        'SELECT datname FROM pg_database WHERE starts_with(datname, $1)',
        [name],
      );
      for (const { datname } of rows)
        await admin.query(`DROP DATABASE IF EXISTS ${datname} WITH (FORCE)`);
    } finally {
      await admin.end();
    }
  });
}

/** Any fixed number names the lock: it is the test cluster's template lock. */
export const TEMPLATE_LOCK = 1_729_017;

/** This process's wait for the template (each spec file runs in a process of its own). */
let templateMade: Promise<void> | undefined;

/**
 * Makes the template once per run: the first process to ask migrates it while the others wait on
 * an advisory lock. It is migrated under another name and renamed when done, so a process
 * killed mid-migration leaves no half-made template behind for the others to copy. Connections
 * to it are then refused: a database is copied only while nobody is connected to it.
 */
export async function makeTemplate(adminUrl: string, name: string): Promise<void> {
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  try {
    // Released when this session ends, whatever happens below.
    await admin.query('SELECT pg_advisory_lock($1)', [TEMPLATE_LOCK]);
    const found = await admin.query('SELECT 1 FROM pg_database WHERE datname = $1', [name]);
    if (found.rowCount) return;
    const building = `${name.slice(0, 50)}_building`;
    await admin.query(`DROP DATABASE IF EXISTS ${building} WITH (FORCE)`);
    await admin.query(`CREATE DATABASE ${building}`);
    // Opened as a server opens it (which migrates it), and closed: no connection stays.
    await (await openDatabase(databaseUrl(adminUrl, building))).close();
    await admin.query(`ALTER DATABASE ${building} RENAME TO ${name}`);
    await admin.query(`ALTER DATABASE ${name} ALLOW_CONNECTIONS false`);
  } finally {
    await admin.end();
  }
}

/**
 * Creates a database a server can use as it is, dropped when the test ends; returns its URL: a
 * copy of the run's migrated template when there is one (the server finds nothing to migrate),
 * else an empty one the server migrates on opening.
 */
export async function migratedPostgresDatabase(t: AfterHook, adminUrl: string): Promise<string> {
  const template = testPostgresTemplate();
  if (!template) return createTestDatabase(t, adminUrl);
  templateMade ??= makeTemplate(adminUrl, template).catch((error: unknown) => {
    templateMade = undefined;
    throw error;
  });
  await templateMade;
  return createTestDatabase(t, adminUrl, template);
}

/**
 * The database settings of a test server: LARDER_DB_URL of a fresh database on the test cluster
 * (migrated already when the run keeps a template), or none (the SQLite file in the server's data
 * folder).
 */
export async function testDatabaseEnv(t: AfterHook): Promise<Record<string, string>> {
  const adminUrl = testPostgresUrl();
  return adminUrl ? { LARDER_DB_URL: await migratedPostgresDatabase(t, adminUrl) } : {};
}

/**
 * Makes a test database take no writes, as a hot standby does (every write refused with 25006
 * read_only_sql_transaction), or take them again: default_transaction_read_only for every session
 * that starts from now on, set by the cluster's admin.
 */
export async function setPostgresReadOnly(url: string, readOnly: boolean): Promise<void> {
  const adminUrl = testPostgresUrl();
  if (!adminUrl) throw new Error('LARDER_TEST_PG_URL is not set');
  const name = decodeURIComponent(new URL(url).pathname.slice(1));
  await asAdmin(
    adminUrl,
    `ALTER DATABASE "${name}" SET default_transaction_read_only = ${readOnly ? 'on' : 'off'}`,
  );
}

/**
 * Ends every connection to a test database from the cluster's admin connection
 * (pg_terminate_backend), as a database server's restart or a network cut does to its clients;
 * returns how many were ended. The cluster itself goes on serving every other database.
 */
export async function endPostgresConnections(url: string): Promise<number> {
  const adminUrl = testPostgresUrl();
  if (!adminUrl) throw new Error('LARDER_TEST_PG_URL is not set');
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    const { rows } = await client.query<{ ended: number }>(
      `SELECT CAST(COUNT(pg_terminate_backend(pid)) AS INTEGER) AS ended FROM pg_stat_activity
        WHERE datname = $1 AND pid <> pg_backend_pid()`,
      [decodeURIComponent(new URL(url).pathname.slice(1))],
    );
    return rows[0].ended;
  } finally {
    await client.end();
  }
}
