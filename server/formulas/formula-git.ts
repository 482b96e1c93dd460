import { execFile } from 'node:child_process';
import { promisify } from 'node:util';

const execFileAsync = promisify(execFile);

/** Longest a git command may take (a pre-commit hook may run `larder check --staged`). */
const GIT_TIMEOUT_MS = 60_000;

/** Who commits: the server itself, so a machine without a git identity still works. */
const COMMITTER = { name: 'Larderbook', email: 'larderbook@larderbook.invalid' };

/** What came of committing a formula file. */
export interface GitOutcome {
  /** The new commit's sha; null when the folder is not in a git work tree or nothing was committed. */
  readonly commit: string | null;
  /** Why there is no commit although the folder is in a git work tree. */
  readonly warning?: string;
}

/** The person a commit is authored by. */
export interface GitAuthor {
  readonly username: string;
  readonly displayName: string;
}

// One git command at a time per folder: two at once would trip over git's index.lock, and each
// commit's sha is read right after it is made.
const queues = new Map<string, Promise<unknown>>();

function serialized<T>(folder: string, work: () => Promise<T>): Promise<T> {
  const previous = queues.get(folder) ?? Promise.resolve();
  const next = previous.then(work, work);
  const settled = next.catch(() => undefined);
  queues.set(folder, settled);
  void settled.then(() => {
    if (queues.get(folder) === settled) queues.delete(folder);
  });
  return next;
}

async function git(folder: string, args: string[]): Promise<string> {
  // execFile: arguments go to git as they are, never through a shell.
  const { stdout } = await execFileAsync('git', args, {
    cwd: folder,
    timeout: GIT_TIMEOUT_MS,
    windowsHide: true,
    env: {
      ...process.env,
      GIT_COMMITTER_NAME: COMMITTER.name,
      GIT_COMMITTER_EMAIL: COMMITTER.email,
      GIT_TERMINAL_PROMPT: '0',
    },
  });
  return stdout;
}

function firstLine(error: unknown): string {
  const failure = error as { stderr?: string; message?: string };
  const text = (failure.stderr || failure.message || String(error)).trim();
  return text.split('\n').find((line) => line.trim() !== '') ?? 'unknown error';
}

/**
 * Whether a folder is a kept part of a git work tree: inside one, and not ignored by it (the
 * demo's formulas live in the ignored data folder of the Larderbook checkout, which must not
 * get commits). False when git is not installed.
 */
export async function isGitWorkTree(folder: string): Promise<boolean> {
  try {
    if ((await git(folder, ['rev-parse', '--is-inside-work-tree'])).trim() !== 'true') return false;
  } catch {
    return false;
  }
  try {
    await git(folder, ['check-ignore', '-q', '.']);
    return false; // exit 0: the folder is ignored
  } catch {
    return true; // exit 1: not ignored
  }
}

/** "Display Name <username@larderbook.invalid>", with the characters git cannot take removed. */
export function gitAuthor(author: GitAuthor): string {
  const name = author.displayName.replace(/[<>\r\n]/g, '').trim() || author.username;
  return `${name} <${author.username}@larderbook.invalid>`;
}

/**
 * Commits one formula file (already written) when the formulas folder is in a git work tree:
 * `git add`, then `git commit -- FILE` so nothing else staged goes with it. Never throws: a
 * failure comes back as a warning, and the file stays saved.
 * @param name the file's name within the folder, never taken from a request
 */
export function commitFormulaFile(
  folder: string,
  name: string,
  message: string,
  author: GitAuthor,
): Promise<GitOutcome> {
  return serialized(folder, async () => {
    if (!(await isGitWorkTree(folder))) return { commit: null };
    try {
      await git(folder, ['add', '--', name]);
      try {
        await git(folder, ['diff', '--cached', '--quiet', '--', name]);
        return {
          commit: null,
          warning: 'git has nothing to commit: the file is as in the last commit',
        };
      } catch (error) {
        // Exit code 1 means there are staged changes to commit; anything else is a failure.
        if ((error as { code?: unknown }).code !== 1) throw error;
      }
      await git(folder, ['commit', '-m', message, '--author', gitAuthor(author), '--', name]);
      return { commit: (await git(folder, ['rev-parse', 'HEAD'])).trim() };
    } catch (error) {
      return {
        commit: null,
        warning: `the file is saved, but git could not commit it: ${firstLine(error)}`,
      };
    }
  });
}
