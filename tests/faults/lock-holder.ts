// Another program with the database open in a write transaction: what a backup tool, the
// sqlite3 shell or a stuck script does to the server.
import { spawn, type ChildProcess } from 'node:child_process';
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

/** Starts a process that takes the write lock of a database file, and waits until it holds it. */
export async function holdWriteLock(t: AfterHook, file: string): Promise<LockHolder> {
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
