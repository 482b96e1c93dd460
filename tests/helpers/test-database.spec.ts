import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import pg from 'pg';
import { openDatabase } from '../../server/db/database.ts';
import {
  freshPostgresDatabase,
  migratedPostgresDatabase,
  ownTemplateWhenAlone,
  testPostgresTemplate,
  testPostgresUrl,
} from './test-database.ts';

/** The rows of one query on a database of the test cluster, on a connection of its own. */
async function rowsOf(url: string, sql: string): Promise<Record<string, unknown>[]> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return (await client.query(sql)).rows;
  } finally {
    await client.end();
  }
}

const MIGRATIONS_DONE = 'SELECT name FROM schema_migrations ORDER BY name';
const TABLES = `SELECT COUNT(*)::int AS count FROM information_schema.tables
                 WHERE table_schema = 'public'`;

// Only PostgreSQL has test databases to copy: each SQLite test server makes its own file.
const adminUrl = testPostgresUrl();
if (adminUrl)
  describe('test databases on PostgreSQL: copies of one migrated template, or empty', () => {
    ownTemplateWhenAlone(adminUrl);

    it('should give a copy holding every migration a server would apply itself', async (t) => {
      const copy = await migratedPostgresDatabase(t, adminUrl);
      // A server migrating an empty database of its own is what the copy stands in for.
      const own = await freshPostgresDatabase(t, adminUrl);
      await (await openDatabase(own)).close();
      const expected = await rowsOf(own, MIGRATIONS_DONE);
      assert.ok(expected.length >= 22, `${expected.length} migrations`);
      assert.deepEqual(await rowsOf(copy, MIGRATIONS_DONE), expected);
      // Opening the copy finds nothing left to do and changes nothing.
      await (await openDatabase(copy)).close();
      assert.deepEqual(await rowsOf(copy, MIGRATIONS_DONE), expected);
    });

    it('should give each test a database of its own: a write to one copy is not in another', async (t) => {
      const first = await migratedPostgresDatabase(t, adminUrl);
      const second = await migratedPostgresDatabase(t, adminUrl);
      assert.notEqual(first, second);
      await rowsOf(
        first,
        `INSERT INTO sites (key, name, created_at) VALUES ('harbour', 'Harbour', '2026-01-01')`,
      );
      const keys = (url: string) => rowsOf(url, 'SELECT key FROM sites ORDER BY key');
      assert.deepEqual(
        (await keys(first)).map((row) => row.key),
        ['harbour', 'main'],
      );
      assert.deepEqual(
        (await keys(second)).map((row) => row.key),
        ['main'],
      );
    });

    it('should keep the template closed to connections, so that copying it never fails', async () => {
      const [template] = await rowsOf(
        adminUrl,
        `SELECT datallowconn FROM pg_database WHERE datname = '${testPostgresTemplate()}'`,
      );
      assert.equal(template.datallowconn, false);
    });

    it('should give the specs of the migrations an empty database on request', async (t) => {
      const empty = await freshPostgresDatabase(t, adminUrl);
      assert.deepEqual(await rowsOf(empty, TABLES), [{ count: 0 }]);
    });
  });
