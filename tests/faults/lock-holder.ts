// Another program with the database open in a write transaction: what a backup tool, the
// sqlite3 shell or a stuck script does to the server.
import { spawn, type ChildProcess } from 'node:child_process';
import pg from 'pg';
import { REPO_ROOT } from '../helpers/run-larder.ts';
import type { AfterHook } from './server-process.ts';

// Runs in a process of its own: BEGIN EXCLUSIVE, say so, and hold it until stdin closes.
const HOLDER = `
const sqlite3 = require('sqlite3');
const db = new sqlite3.Database(process.argv[1], sqlite3.OPEN_READWRITE, (error) => {
  if (error) { console.error(error.message); process.exit(1); }
  db.exec('BEGIN EXCLUSIVE', (error) => {
    if (error) { console.error(error.message); process.exit(1); }
    console.log('holding the write lock');
  });
});
process.stdin.on('end', () => db.exec('ROLLBACK', () => db.close(() => process.exit(0))));
process.stdin.resume();
`;

/** A process holding the database's write lock. */
export interface LockHolder {
  /** Ends its transaction (rolled back) and waits until the process has exited. */
  release(): Promise<void>;
}

/**
 * Starts a process that takes the write lock of a database file, and waits until it holds it; on
 * PostgreSQL (a postgres:// location), a connection that locks every table against writes
 * (EXCLUSIVE: reads go on) in a transaction left open, as a stuck script would.
 */
export async function holdWriteLock(t: AfterHook, file: string): Promise<LockHolder> {
  if (/^postgres(ql)?:/.test(file)) return holdPostgresTables(t, file);
  const child: ChildProcess = spawn(process.execPath, ['-e', HOLDER, file], {
    cwd: REPO_ROOT,
    stdio: ['pipe', 'pipe', 'pipe'],
  });
  const exited = new Promise<number | null>((resolve) => child.once('exit', resolve));
  t.after(async () => {
    if (child.exitCode === null) child.kill('SIGKILL');
    await exited;
  });
  let seen = '';
  await new Promise<void>((resolve, reject) => {
    child.stdout?.on('data', (chunk: Buffer) => {
      seen += chunk.toString();
      if (seen.includes('holding the write lock')) resolve();
    });
    child.stderr?.on('data', (chunk: Buffer) => (seen += chunk.toString()));
    void exited.then((code) => reject(new Error(`the lock holder exited (${code}): ${seen}`)));
  });
  return {
    release: async () => {
      child.stdin?.end();
      await exited;
    },
  };
}

async function holdPostgresTables(t: AfterHook, url: string): Promise<LockHolder> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  let released = false;
  const release = async (): Promise<void> => {
    if (released) return;
    released = true;
    await client.query('ROLLBACK');
    await client.end();
  };
  t.after(release);
  const { rows } = await client.query<{ name: string }>(
    "SELECT quote_ident(tablename) AS name FROM pg_tables WHERE schemaname = 'public'",
  );
  await client.query('BEGIN');
  await client.query(`LOCK TABLE ${rows.map((row) => row.name).join(', ')} IN EXCLUSIVE MODE`);
  return { release };
}
