// The settings that give the `larder` command records of its own in a test: a data folder, and on
// the PostgreSQL cluster of `npm run test:pg` a fresh database (LARDER_DB_URL) as well.
import path from 'node:path';
import { testDatabaseEnv } from './test-database.ts';
import { makeTempDir } from './temp-files.ts';

/** The part of a node:test context these helpers need. */
interface TestContext {
  after(fn: () => unknown): void;
}

/** LARDER_DATA of a fresh folder, with LARDER_DB_URL of a fresh database when the suite runs on PostgreSQL. */
export async function localRecordsEnv(t: TestContext): Promise<Record<string, string>> {
  return { LARDER_DATA: path.join(makeTempDir(t), 'data'), ...(await testDatabaseEnv(t)) };
}
