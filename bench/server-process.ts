// Starts the built server as its own process for benchmarks, on a fresh data folder.
import { spawn, type ChildProcess } from 'node:child_process';
import { cpSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { buildBundle, BUNDLES } from '../scripts/bundles.mjs';
import { WARM_UP_AFTER_MS } from '../server/pdf/warm-pdf.ts';

/** A running server and how to reach and stop it. */
export interface BenchServer {
  readonly url: string;
  readonly child: ChildProcess;
  readonly dataDir: string;
  /** When the server said it listens (performance.now()). */
  readonly listenedAt: number;
  /** Resident memory of the server process now, in MB. */
  rssMb(): number;
  /** The most resident memory a server process has held since it started (VmHWM), in MB. */
  peakRssMb(): number;
  /** CPU time the server has used so far, seconds (Linux: /proc/PID/stat); 0 where there is no /proc. */
  cpuSeconds(): number;
  /** Starts the peak RSS over from now (Linux: /proc/PID/clear_refs); false where it cannot. */
  resetPeakRss(): boolean;
  /** Everything the server (all its processes) has printed on its standard output so far. */
  output(): string;
  /** Stops the server; its output then holds what it printed while stopping. */
  stop(): Promise<void>;
}

/**
 * Builds the server bundle, then starts it on a free port: on a fresh data folder with the demo
 * people and formulas, or on LARDER_DATA when given (kept afterwards with keepData).
 */
export async function startBenchServer(
  env: Record<string, string> = {},
  options: { keepData?: boolean } = {},
): Promise<BenchServer> {
  await buildBundle('server');
  const dataDir = env.LARDER_DATA ?? mkdtempSync(path.join(tmpdir(), 'larder-bench-'));
  if (!env.LARDER_DATA) cpSync('formulas', path.join(dataDir, 'formulas'), { recursive: true });
  // As npm start runs it (scripts/start.mjs), node options included; BENCH_PROFILE_DIR has the
  // server write a CPU profile there when it stops (node --cpu-prof), for the README's profile.
  const profile = process.env.BENCH_PROFILE_DIR
    ? ['--cpu-prof', `--cpu-prof-dir=${process.env.BENCH_PROFILE_DIR}`]
    : [];
  const serverArgs = [...BUNDLES.server.nodeOptions, ...profile, BUNDLES.server.outfile];
  const child = spawn(process.execPath, serverArgs, {
    env: {
      ...process.env,
      LARDER_DATA: dataDir,
      LARDER_PORT: '0',
      LARDER_SIGN_IN_LIMIT: '10000',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  let seen = '';
  const url = await new Promise<string>((resolve, reject) => {
    child.stdout?.on('data', (chunk: Buffer) => {
      seen += chunk.toString();
      const match = /at (http:\/\/[\d.]+:\d+)\//.exec(seen);
      if (match) resolve(match[1]);
    });
    child.once('exit', (code) =>
      reject(new Error(`the server exited (${code}) before listening:\n${seen}`)),
    );
  });
  // Linux's account of the process; 0 where there is no /proc.
  // With several processes, the largest of them: the target is per process.
  const statusMb = (field: 'VmRSS' | 'VmHWM'): number =>
    Math.max(
      0,
      ...familyOf(child.pid ?? 0).map((pid) => {
        try {
          const status = readFileSync(`/proc/${pid}/status`, 'utf8');
          return Number(new RegExp(`${field}:\\s+(\\d+) kB`).exec(status)?.[1] ?? 0) / 1024;
        } catch {
          return 0;
        }
      }),
    );
  const listenedAt = performance.now();
  return {
    url,
    child,
    dataDir,
    listenedAt,
    rssMb: () => statusMb('VmRSS'),
    peakRssMb: () => statusMb('VmHWM'),
    cpuSeconds: () => processCpuSeconds(child.pid),
    resetPeakRss: () => {
      try {
        for (const pid of familyOf(child.pid ?? 0)) writeFileSync(`/proc/${pid}/clear_refs`, '5');
        return true;
      } catch {
        return false;
      }
    },
    output: () => seen,
    stop: async () => {
      // 'close', not 'exit': the last lines it printed have been read too.
      const exited = new Promise((resolve) => child.once('close', resolve));
      child.kill('SIGTERM');
      await exited;
      if (!options.keepData) rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

/** One process's /proc/PID/stat fields after its name: state, ppid, …; null where there is none. */
function statFields(pid: number | string): string[] | null {
  try {
    return readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
  } catch {
    return null;
  }
}

/** A process and its live children (the workers of a server of several processes), by pid. */
function familyOf(pid: number): number[] {
  const children = readdirSync('/proc')
    .filter((entry) => /^\d+$/.test(entry) && Number(statFields(entry)?.[1]) === pid)
    .map(Number);
  return [pid, ...children];
}

/**
 * CPU time a process and its live children have used so far, seconds (Linux: /proc/PID/stat);
 * 0 where there is no /proc.
 */
export function processCpuSeconds(pid: number | undefined): number {
  if (pid === undefined) return 0;
  // utime and stime, the 14th and 15th fields, in clock ticks of 1/100 s.
  return familyOf(pid)
    .map((one) => statFields(one))
    .reduce(
      (total, fields) => total + (fields ? (Number(fields[11]) + Number(fields[12])) / 100 : 0),
      0,
    );
}

/** Signs in through the form and returns the cookie and CSRF token. */
export async function signInCookie(
  url: string,
  username: string,
  password: string,
): Promise<{ cookie: string; csrf: string }> {
  const response = await fetch(`${url}/api/session`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ username, password }),
  });
  if (response.status !== 201) throw new Error(`sign-in failed: ${response.status}`);
  const body = (await response.json()) as { csrfToken: string };
  return { cookie: (response.headers.get('set-cookie') ?? '').split(';')[0], csrf: body.csrfToken };
}

/** The Authorization header of HTTP Basic, as scripts and the CLI sign their requests. */
export function basicAuth(username: string, password: string): { authorization: string } {
  return { authorization: `Basic ${Buffer.from(`${username}:${password}`).toString('base64')}` };
}

/**
 * Waits until the server has used under 20 ms of CPU in half a second (at most 30 s): its own
 * work after a start — the PDF warm-up 2 s after it listens (about a second of CPU), the first
 * runs of its jobs — would otherwise land in the first requests timed. Returns the seconds waited.
 */
export async function settled(server: BenchServer): Promise<number> {
  const start = performance.now();
  // A quiet half second before the warm-up has begun proves nothing: it is still to come.
  const warmUpDone = server.listenedAt + WARM_UP_AFTER_MS + 500;
  if (start < warmUpDone) await new Promise((resolve) => setTimeout(resolve, warmUpDone - start));
  for (;;) {
    const before = server.cpuSeconds();
    await new Promise((resolve) => setTimeout(resolve, 500));
    const waited = (performance.now() - start) / 1000;
    if (server.cpuSeconds() - before < 0.02 || waited > 30) return waited;
  }
}
