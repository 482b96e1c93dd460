// Benchmark: POST /api/calc against a bare Express route answering a JSON body of the same size,
// each in a process of its own on loopback, in the same run (50 connections, 10 s each). The bare
// route is measured before and after ours and averaged, so that a change in the machine's load
// during the run weighs on both. Both are sent the same mix of bodies (bench/calc-mix.ts). Prints
// requests/s, p99 and the ratio, for a console session (cookie) and for HTTP Basic (scripts, the
// CLI), then a session again on a server that keeps no answers (LARDER_CALC_CACHE=0).
import autocannon from 'autocannon';
import { spawn } from 'node:child_process';
import { REPEATED, calcBody } from './calc-mix.ts';
import {
  basicAuth,
  processCpuSeconds,
  settled,
  signInCookie,
  startBenchServer,
  type BenchServer,
} from './server-process.ts';

const CONNECTIONS = 50;
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
// Counted on over every run, so a one-off batch of the mix is never asked twice.
let sent = 0;

interface Run {
  perSecond: number;
  p99: number;
  non2xx: number;
  errors: number;
  /** The answering process's CPU time per request, ms: steadier than req/s on a busy machine. */
  cpuMs: number;
}

async function run(url: string, headers: Record<string, string>, pid?: number): Promise<Run> {
  const cpuBefore = processCpuSeconds(pid);
  const result = await autocannon({
    url,
    method: 'POST',
    connections: CONNECTIONS,
    duration: SECONDS,
    headers: { 'content-type': 'application/json', ...headers },
    requests: [{ setupRequest: (request) => ({ ...request, body: calcBody(sent++) }) }],
  });
  return {
    perSecond: result.requests.average,
    p99: result.latency.p99,
    non2xx: result.non2xx,
    errors: result.errors + result.timeouts,
    cpuMs: ((processCpuSeconds(pid) - cpuBefore) * 1000) / Math.max(1, result.requests.total),
  };
}

/** Starts bench/bare-route.ts answering `body`; returns its URL and how to stop it. */
async function startBareRoute(
  body: string,
  processes = 1,
): Promise<{ url: string; pid?: number; stop: () => Promise<void> }> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'bench/bare-route.ts'], {
    stdio: ['pipe', 'pipe', 'inherit'],
    env: { ...process.env, BARE_PROCESSES: String(processes) },
  });
  child.stdin.end(body);
  const port = await new Promise<string>((resolve, reject) => {
    let seen = '';
    child.stdout.on('data', (chunk: Buffer) => {
      seen += chunk.toString();
      const match = /listening on (\d+)/.exec(seen);
      if (match) resolve(match[1]);
    });
    child.once('exit', (code) => reject(new Error(`the bare route exited (${code})`)));
  });
  return {
    url: `http://127.0.0.1:${port}/calc`,
    pid: child.pid,
    stop: async () => {
      const exited = new Promise((resolve) => child.once('exit', resolve));
      child.kill('SIGTERM');
      await exited;
    },
  };
}

function line(label: string, ours: Run, bare: number): string {
  const ratio = ours.perSecond / bare;
  return (
    `  ${label}: ${ours.perSecond.toFixed(0)} req/s, p99 ${ours.p99} ms, ${ours.cpuMs.toFixed(2)} ms of server CPU a request, ${ours.non2xx} non-2xx, ${ours.errors} errors; ` +
    `ratio ${(ratio * 100).toFixed(0)} % of bare (target ≥ 50 %, p99 ≤ 25 ms)\n`
  );
}

/** The share of calculations a server answered from its kept answers, from its stop line. */
function keptShare(server: BenchServer): string {
  const lines = [...server.output().matchAll(/answered from the kept answers: (\d+) of (\d+)/g)];
  const found = lines.reduce((sum, match) => sum + Number(match[1]), 0);
  const asked = lines.reduce((sum, match) => sum + Number(match[2]), 0);
  return asked > 0 ? `${((100 * found) / asked).toFixed(1)} % (${found} of ${asked})` : 'none';
}

/** Signs in, checks every body of the mix answers 200, and returns the answers' median size. */
async function checkMix(url: string, session: Record<string, string>): Promise<string> {
  const answers: string[] = [];
  for (const body of REPEATED) {
    const response = await fetch(`${url}/api/calc`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', ...session },
      body: JSON.stringify(body),
    });
    const text = await response.text();
    if (response.status !== 200)
      throw new Error(`POST /api/calc ${JSON.stringify(body)}: HTTP ${response.status} ${text}`);
    answers.push(text);
  }
  return answers.sort((a, b) => a.length - b.length)[Math.floor(answers.length / 2)];
}

/**
 * Runs the comparison and prints it, with `processes` server processes and as many bare-route
 * processes (like for like).
 */
export async function benchCalcApi(processes = 1): Promise<{
  ratio: number;
  p99: number;
  rssMb: number;
  perSecond: number;
  barePerSecond: number;
}> {
  const env = { LARDER_PROCESSES: String(processes) };
  // The server that keeps no answers runs after the other has stopped: one server at a time.
  let server = await startBenchServer(env);
  let stopped = false;
  try {
    const signIn = async (url: string) => {
      const { cookie, csrf } = await signInCookie(url, 'imke', 'quillmoor-review');
      return { cookie, 'x-csrf-token': csrf };
    };
    const session = await signIn(server.url);
    const basic = basicAuth('imke', 'quillmoor-review');
    // The bare route answers the mix's median answer, so the bytes written are alike.
    const sample = await checkMix(server.url, session);
    // Its own work after a start (the PDF warm-up 2 s after it listens) stays out of the runs.
    const quiet = async () => {
      await new Promise((resolve) => setTimeout(resolve, 2500));
      await settled(server);
    };
    await quiet();

    const bareRoute = await startBareRoute(sample, processes);
    let before: Run;
    let after: Run;
    let cookieRun: Run;
    let basicRun: Run;
    let unkeptRun: Run;
    let kept: string;
    let rssMb: number;
    // Requests still queued when a run stops are answered before the next run starts.
    const settle = (): Promise<void> => new Promise((resolve) => setTimeout(resolve, 1500));
    try {
      before = await run(bareRoute.url, {}, bareRoute.pid);
      await settle();
      cookieRun = await run(`${server.url}/api/calc`, session, server.child.pid);
      await settle();
      basicRun = await run(`${server.url}/api/calc`, basic, server.child.pid);
      rssMb = server.peakRssMb();
      await server.stop();
      kept = keptShare(server);
      server = await startBenchServer({ ...env, LARDER_CALC_CACHE: '0' });
      const unkeptSession = await signIn(server.url);
      await quiet();
      unkeptRun = await run(`${server.url}/api/calc`, unkeptSession, server.child.pid);
      rssMb = Math.max(rssMb, server.peakRssMb());
      await server.stop();
      stopped = true;
      await settle();
      after = await run(bareRoute.url, {}, bareRoute.pid);
    } finally {
      await bareRoute.stop();
    }
    const bare = (before.perSecond + after.perSecond) / 2;
    process.stdout.write(
      `POST /api/calc (${processes} process${processes > 1 ? 'es' : ''} each, ${CONNECTIONS} connections, ${SECONDS} s per run, ${REPEATED.length} batches asked again and a one-off in every 4; ${sample.length} B median answer)\n` +
        `  bare Express route: ${bare.toFixed(0)} req/s (${before.perSecond.toFixed(0)} before, ${after.perSecond.toFixed(0)} after), p99 ${Math.max(before.p99, after.p99)} ms, ${((before.cpuMs + after.cpuMs) / 2).toFixed(2)} ms of CPU a request\n` +
        line('signed in (session cookie)', cookieRun, bare) +
        line('HTTP Basic', basicRun, bare) +
        `  answered from the kept answers, both runs: ${kept}\n` +
        line('signed in, no answers kept (LARDER_CALC_CACHE=0)', unkeptRun, bare) +
        `  server peak RSS ${rssMb.toFixed(0)} MB (target ≤ 250 MB)\n`,
    );
    return {
      ratio: cookieRun.perSecond / bare,
      p99: cookieRun.p99,
      rssMb,
      perSecond: cookieRun.perSecond,
      barePerSecond: bare,
    };
  } finally {
    if (!stopped) await server.stop();
  }
}
