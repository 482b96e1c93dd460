// A fresh PostgreSQL database for each test server when LARDER_TEST_PG_URL names a cluster
// (`npm run test:pg` starts a throw-away one); nothing at all when it is not set (SQLite).
import { randomBytes } from 'node:crypto';
import pg from 'pg';

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

/**
 * Creates an empty database with a random name on the test cluster and drops it when the test
 * ends (its connections ended first, WITH FORCE); returns its URL.
 */
export async function freshPostgresDatabase(t: AfterHook, adminUrl: string): Promise<string> {
  const name = `larder_test_${randomBytes(6).toString('hex')}`;
  await asAdmin(adminUrl, `CREATE DATABASE ${name}`);
  t.after(() => asAdmin(adminUrl, `DROP DATABASE IF EXISTS ${name} WITH (FORCE)`));
  const url = new URL(adminUrl);
  url.pathname = `/${name}`;
  return url.toString();
}

/**
 * The database settings of a test server: LARDER_DB_URL of a fresh database on the test cluster,
 * or none (the SQLite file in the server's data folder).
 */
export async function testDatabaseEnv(t: AfterHook): Promise<Record<string, string>> {
  const adminUrl = testPostgresUrl();
  return adminUrl ? { LARDER_DB_URL: await freshPostgresDatabase(t, adminUrl) } : {};
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
