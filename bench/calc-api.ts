// Benchmark: POST /api/calc against a bare Express route answering a JSON body of the same size,
// both on loopback in the same run (50 connections, 10 s each). Prints requests/s, p99 and the ratio.
import autocannon from 'autocannon';
import express from 'express';
import type { AddressInfo } from 'node:net';
import { signInCookie, startBenchServer } from './server-process.ts';

const CONNECTIONS = 50;
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const BODY = JSON.stringify({
  formula: 'quillmoor-belly',
  batch: { meat: '4.26 kg', thickness: '4 cm', start: '2026-12-02' },
});

function run(url: string, headers: Record<string, string>): Promise<autocannon.Result> {
  return autocannon({
    url,
    method: 'POST',
    connections: CONNECTIONS,
    duration: SECONDS,
    headers: { 'content-type': 'application/json', ...headers },
    body: BODY,
  });
}

/** Runs the comparison and prints it. */
export async function benchCalcApi(): Promise<{ ratio: number; p99: number; rssMb: number }> {
  const server = await startBenchServer();
  try {
    const { cookie, csrf } = await signInCookie(server.url, 'imke', 'quillmoor-review');
    const headers = { cookie, 'x-csrf-token': csrf };
    const sample = await (
      await fetch(`${server.url}/api/calc`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', ...headers },
        body: BODY,
      })
    ).text();

    // The bare route answers the same bytes without any work, in a process of its own.
    const bare = express();
    bare.use(express.json());
    bare.post('/calc', (_req, res) => void res.type('json').send(sample));
    const listener = bare.listen(0, '127.0.0.1');
    await new Promise((resolve) => listener.once('listening', resolve));
    const bareUrl = `http://127.0.0.1:${(listener.address() as AddressInfo).port}/calc`;

    const baseline = await run(bareUrl, {});
    let peakRss = 0;
    const sampler = setInterval(() => (peakRss = Math.max(peakRss, server.rssMb())), 250);
    const ours = await run(`${server.url}/api/calc`, headers);
    clearInterval(sampler);
    listener.close();
    const ratio = ours.requests.average / baseline.requests.average;
    process.stdout.write(
      `POST /api/calc (${CONNECTIONS} connections, ${SECONDS} s, ${sample.length} B body): ${ours.requests.average.toFixed(0)} req/s, p99 ${ours.latency.p99} ms, ${ours.non2xx} non-2xx; ` +
        `bare route ${baseline.requests.average.toFixed(0)} req/s, p99 ${baseline.latency.p99} ms; ratio ${(ratio * 100).toFixed(0)} % (target ≥ 50 %, p99 ≤ 25 ms); server RSS peak ${peakRss.toFixed(0)} MB\n`,
    );
    return { ratio, p99: ours.latency.p99, rssMb: peakRss };
  } finally {
    await server.stop();
  }
}
