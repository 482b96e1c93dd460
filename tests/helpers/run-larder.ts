import assert from 'node:assert/strict';
import { execFile } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { makeTempDir } from './temp-files.ts';

/** The repository root: the built command runs from here unless a test gives another folder. */
export const REPO_ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');

/** The published entry, as a user runs it; it imports the bundle built by scripts/build-cli.mjs. */
const BIN = 'bin/larder.js';
const BUNDLE = path.join(REPO_ROOT, 'dist', 'cli', 'larder.js');

/** Settings a user may have that would change what larder prints; tests start without them. */
const CLEARED_VARIABLES = [
  'LARDER_DATA',
  'LARDER_DB',
  'LARDER_DB_URL',
  'LARDER_MODE',
  'LARDER_NEW_PASSWORD',
  'LARDER_SERVER',
  'LARDER_USER',
  'LARDER_PASSWORD',
  'LARDER_FORMULAS',
  'LARDER_UNITS',
  'LARDER_CHECK_THREADS',
  'NODE_TEST_CONTEXT',
  'NODE_OPTIONS',
  'FORCE_COLOR',
];

/** What one run of the command did. */
export interface LarderRun {
  readonly args: readonly string[];
  readonly code: number;
  readonly stdout: string;
  readonly stderr: string;
}

/** Where and with what environment to run the command. */
export interface RunOptions {
  /** Working folder; the repository root by default. */
  readonly cwd?: string;
  /** Variables to set (a string) or remove (undefined) on top of the cleaned environment. */
  readonly env?: Readonly<Record<string, string | undefined>>;
}

function childEnvironment(extra: RunOptions['env']): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = { ...process.env, NO_COLOR: '1' };
  for (const name of CLEARED_VARIABLES) delete env[name];
  for (const [name, value] of Object.entries(extra ?? {})) {
    if (value === undefined) delete env[name];
    else env[name] = value;
  }
  return env;
}

/**
 * Runs the built `larder` command as a child process, as a user would
 * (`node bin/larder.js ARGS…`), and resolves with its exit code, stdout and stderr. It never
 * rejects on a non-zero exit; it rejects only when the process could not run or was killed.
 */
export function runLarder(args: readonly string[], options: RunOptions = {}): Promise<LarderRun> {
  if (!existsSync(BUNDLE)) {
    return Promise.reject(
      new Error(`${BUNDLE} is missing: run \`node scripts/build-cli.mjs\` before the CLI tests`),
    );
  }
  const cwd = options.cwd ?? REPO_ROOT;
  const bin = cwd === REPO_ROOT ? BIN : path.join(REPO_ROOT, BIN);
  return new Promise((resolve, reject) => {
    execFile(
      process.execPath,
      [bin, ...args],
      {
        cwd,
        env: childEnvironment(options.env),
        encoding: 'utf8',
        timeout: 30_000,
        maxBuffer: 16 * 1024 * 1024,
      },
      (error, stdout, stderr) => {
        if (error && typeof error.code !== 'number') {
          reject(
            new Error(`larder ${args.join(' ')} did not finish (${error.message})\n${stderr}`),
          );
          return;
        }
        resolve({ args, code: typeof error?.code === 'number' ? error.code : 0, stdout, stderr });
      },
    );
  });
}

/** A run as text for assertion messages, so a failure shows what the command printed. */
export function showRun(run: LarderRun): string {
  return `larder ${run.args.join(' ')} → exit ${run.code}\n--- stdout ---\n${run.stdout}--- stderr ---\n${run.stderr}`;
}

/** Asserts the exit code, showing the whole run when it differs. */
export function assertExit(run: LarderRun, code: number): void {
  assert.equal(run.code, code, showRun(run));
}

/** Asserts that stderr holds no JavaScript stack trace and no "unexpected error" banner. */
export function assertNoStackTrace(run: LarderRun): void {
  assert.ok(!run.stderr.includes('    at '), `stack trace on stderr:\n${showRun(run)}`);
  assert.ok(!run.stderr.includes('unexpected error'), `internal error reported:\n${showRun(run)}`);
}

/**
 * Asserts a failure a person can act on: the exit code, nothing on stdout, a message on stderr
 * that matches, and no stack trace. With `oneLine`, the whole message is a single line.
 */
export function assertCleanFailure(
  run: LarderRun,
  code: number,
  message: RegExp,
  { oneLine = false } = {},
): void {
  assertExit(run, code);
  assertNoStackTrace(run);
  assert.equal(run.stdout, '', `nothing should be printed on stdout:\n${showRun(run)}`);
  assert.match(run.stderr, message, showRun(run));
  if (oneLine)
    assert.equal(
      run.stderr.trimEnd().split('\n').length,
      1,
      `one line expected on stderr:\n${showRun(run)}`,
    );
}

/** Parses stdout as JSON, failing with the whole run shown when it is not. */
export function stdoutJson<T>(run: LarderRun): T {
  try {
    return JSON.parse(run.stdout) as T;
  } catch (error) {
    assert.fail(`stdout is not JSON (${String(error)}):\n${showRun(run)}`);
  }
}

/** The JSON object printed on stdout for a failure with --json. */
export interface JsonFailure {
  readonly error: {
    readonly message: string;
    readonly exitCode: number;
    readonly details: readonly string[];
  };
}

/** Text made safe to put inside a RegExp, e.g. a temporary file path. */
export function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

/** The report `larder check --json` prints. */
export interface CheckReport {
  readonly summary: {
    readonly files: number;
    readonly ok: number;
    readonly failed: number;
    readonly warnings: number;
  };
  readonly files: readonly {
    readonly file: string;
    readonly id?: string;
    readonly kind?: string;
    readonly ok: boolean;
    readonly problems: readonly {
      readonly file: string;
      readonly line: number;
      readonly column: number;
      readonly severity: string;
      readonly message: string;
    }[];
  }[];
}

/**
 * A fresh database on this machine with one cook, tobin, and the settings that record as them:
 * `LARDER_DATA`, `LARDER_USER` and `LARDER_PASSWORD`.
 */
export async function localCook(t: { after(fn: () => unknown): void }): Promise<{
  readonly LARDER_DATA: string;
  readonly LARDER_USER: string;
  readonly LARDER_PASSWORD: string;
}> {
  const data = path.join(makeTempDir(t), 'data');
  const password = 'tobin-pass-1';
  assertExit(
    await runLarder(['users', 'add', 'tobin', '--role', 'cook'], {
      env: { LARDER_DATA: data, LARDER_NEW_PASSWORD: password },
    }),
    0,
  );
  return { LARDER_DATA: data, LARDER_USER: 'tobin', LARDER_PASSWORD: password };
}
