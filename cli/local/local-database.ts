import { loadConfig, type ServerConfig } from '../../server/config.ts';
import { openDatabase, type Database } from '../../server/db/database.ts';
import { CliError, EXIT } from '../cli-error.ts';

/**
 * Opens this machine's Larderbook database — the same file the server uses, found through the
 * same settings (LARDER_DATA, LARDER_DB) — runs `work` and closes it.
 */
export async function withLocalDatabase<T>(
  work: (db: Database, config: ServerConfig) => Promise<T>,
): Promise<T> {
  let config: ServerConfig;
  try {
    config = loadConfig();
  } catch (error) {
    throw new CliError((error as Error).message, EXIT.usage);
  }
  const db = await openDatabase(config.databaseFile);
  try {
    return await work(db, config);
  } finally {
    await db.close();
  }
}
