import { existsSync, renameSync, rmSync, statSync } from 'node:fs';
import path from 'node:path';
import { RecordsError, openRecords, recordsFile } from '../../server/records/records.ts';
import { CliError, EXIT } from '../cli-error.ts';
import { cliErrorOf } from '../records/records-failure.ts';

/** What a finished backup holds, read back from the copy itself. */
export interface BackupSummary {
  readonly file: string;
  readonly bytes: number;
  readonly batches: number;
  readonly people: number;
  readonly from: string;
}

/**
 * Copies this machine's database to `target` while the server may be running, consistent
 * without stopping writers. The copy is written beside the target under a temporary name, checked (integrity_check) and
 * only then renamed, so a backup file is never half-written. An existing file is never replaced.
 */
export async function backupDatabase(target: string): Promise<BackupSummary> {
  let source: string;
  try {
    source = recordsFile();
  } catch (error) {
    throw error instanceof RecordsError ? cliErrorOf(error, 'backup') : error;
  }
  const file = path.resolve(target);
  if (!existsSync(source))
    throw new CliError(
      `there is no database at ${source} (set LARDER_DATA or LARDER_DB)`,
      EXIT.usage,
    );
  if (existsSync(file))
    throw new CliError(`${file} exists already; name a new file for the backup`, EXIT.usage);
  if (!existsSync(path.dirname(file)))
    throw new CliError(`the folder ${path.dirname(file)} does not exist`, EXIT.usage);
  const partial = path.join(path.dirname(file), `.${path.basename(file)}.${process.pid}.partial`);
  try {
    const records = await openRecords();
    try {
      await records.copyTo(partial);
    } finally {
      await records.close();
    }
    const summary = await readBack(partial);
    renameSync(partial, file);
    return { ...summary, file, bytes: statSync(file).size, from: source };
  } finally {
    rmSync(partial, { force: true });
  }
}

/** Opens the copy read-only, on its own, and proves it whole; counts what it holds. */
async function readBack(copy: string): Promise<{ batches: number; people: number }> {
  const { default: sqlite3 } = await import('sqlite3');
  const db = await new Promise<InstanceType<typeof sqlite3.Database>>((resolve, reject) => {
    const opened = new sqlite3.Database(copy, sqlite3.OPEN_READONLY, (error) =>
      error ? reject(error) : resolve(opened),
    );
  });
  const all = (sql: string): Promise<Record<string, unknown>[]> =>
    new Promise((resolve, reject) =>
      db.all(sql, (error, rows) =>
        error ? reject(error) : resolve(rows as Record<string, unknown>[]),
      ),
    );
  try {
    const verdict = (await all('PRAGMA integrity_check')).map((row) => row.integrity_check);
    if (verdict.join('; ') !== 'ok')
      throw new CliError(
        `the copy failed SQLite's integrity check: ${verdict.join('; ')}`,
        EXIT.internal,
      );
    const count = async (table: string): Promise<number> =>
      Number((await all(`SELECT count(*) AS n FROM ${table}`))[0]?.n ?? 0);
    return { batches: await count('batches'), people: await count('people') };
  } finally {
    await new Promise<void>((resolve) => db.close(() => resolve()));
  }
}
