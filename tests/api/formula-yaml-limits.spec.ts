import assert from 'node:assert/strict';
import { performance } from 'node:perf_hooks';
import { describe, it } from 'node:test';
import {
  assertErrorEnvelope,
  send,
  snapshot,
  suiteServer,
  type Call,
} from '../helpers/api-calls.ts';
import type { ApiResponse } from '../helpers/test-server.ts';

/**
 * The reported attack: a short formula whose notes open 127,000 lists and close them again,
 * 254 kB of text, under the request body limit. Unguarded, the parser built the nesting until
 * the heap ran out and the server process died.
 */
const ATTACK = `formula: 1\nid: x\ntitle: x\nkind: mix\nnotes: ${'['.repeat(127_000)}${']'.repeat(127_000)}`;

// Line 5 is `notes: [[[…`: "notes: " is 7 characters, so the first "[" is column 8. The file's
// keys are level 1 and each "[" one level more, so the 32nd "[" (column 8 + 31) opens level 33,
// one past the 32 a formula may nest.
const ATTACK_LINE = 5;
const ATTACK_COLUMN = 39;

// A request the server refuses unread answers at once, where the unguarded parser ran until the
// heap ran out. 2 s leaves room for the 254 kB body on a busy machine: beside the browser suites,
// as CI runs them, a refusal took 515 ms. common practice, no source
const MAX_MS = 2_000;
// What one such request may add to the heap or to the process's peak memory: the body as text
// and as parsed JSON are about 1 MB; the unguarded parse grew past the whole heap.
// common practice, no source
const MAX_GROWTH_BYTES = 50 * 1024 * 1024;

/** The largest formula text the API takes: 256 KiB of UTF-8. source: shared/formula/yaml-limits.ts */
const MAX_BYTES = 256 * 1024;

/** A valid mix formula, padded with a comment line to exactly `bytes` bytes of UTF-8. */
function paddedFormula(bytes: number, filler = 'x'): string {
  const head =
    'formula: 1\nid: padded-sauce\ntitle: Padded sauce\nkind: mix\ningredients:\n' +
    '  - { name: mayonnaise, pct: 100, base: true }\n#';
  const room = bytes - Buffer.byteLength(head) - 1;
  const fill = filler.repeat(Math.floor(room / Buffer.byteLength(filler)));
  return `${head}${fill}${'x'.repeat(room - Buffer.byteLength(fill))}\n`;
}

/** The three routes a reviewer can send formula YAML to, with the YAML in each one's place. */
function yamlCalls(yaml: string): Call[] {
  return [
    { method: 'POST', path: '/api/formulas/validate', body: { yaml } },
    { method: 'POST', path: '/api/calc', body: { formula: { yaml }, batch: { base: '1kg' } } },
    {
      method: 'POST',
      path: '/api/formulas/house-sauce/preview',
      body: { yaml, batch: { base: '1kg' } },
    },
  ];
}

/** One request with what it cost: wall time, heap growth, and growth of the peak resident size. */
async function measured(
  run: () => Promise<ApiResponse>,
): Promise<{ response: ApiResponse; ms: number; heapGrowth: number; peakGrowth: number }> {
  const heapBefore = process.memoryUsage().heapUsed;
  // maxRSS is the process's peak resident size so far (in KiB): it shows a spike the garbage
  // collector has already cleared by the time the answer arrives.
  const peakBefore = process.resourceUsage().maxRSS;
  const start = performance.now();
  const response = await run();
  const ms = performance.now() - start;
  return {
    response,
    ms,
    heapGrowth: process.memoryUsage().heapUsed - heapBefore,
    peakGrowth: (process.resourceUsage().maxRSS - peakBefore) * 1024,
  };
}

describe('formula YAML nested beyond reason', () => {
  const server = suiteServer();

  it('should refuse the deep-nesting attack on every route at once, with memory flat, and keep serving', async (t) => {
    // A first request loads the routes' code, so that it does not count as the attack's cost.
    // Every route's: the preview's first answer loaded its own code and took 650 ms on PostgreSQL.
    for (const call of yamlCalls('formula: 1\n')) {
      const warm = await send(server(), 'imke', call);
      assert.ok(warm.status < 500, `${call.path}: ${warm.status} ${warm.text.slice(0, 300)}`);
    }
    for (const call of yamlCalls(ATTACK)) {
      const { response, ms, heapGrowth, peakGrowth } = await measured(() =>
        send(server(), 'imke', call),
      );
      const what = `${call.method} ${call.path}`;
      t.diagnostic(
        `${what}: ${response.status} in ${ms.toFixed(1)} ms, heap ${(heapGrowth / 2 ** 20).toFixed(1)} MB, peak ${(peakGrowth / 2 ** 20).toFixed(1)} MB`,
      );
      assertErrorEnvelope(response, what);
      assert.equal(response.status, 422, `${what}: ${response.text.slice(0, 300)}`);
      assert.equal(response.json.error.code, 'too-complex', what);
      const [problem] = response.json.error.details;
      assert.equal(problem.line, ATTACK_LINE, what);
      assert.equal(problem.column, ATTACK_COLUMN, what);
      assert.match(problem.message, /more than 32 levels deep/, what);
      assert.ok(ms < MAX_MS, `${what} took ${ms.toFixed(0)} ms`);
      assert.ok(heapGrowth < MAX_GROWTH_BYTES, `${what}: heap grew ${heapGrowth} bytes`);
      assert.ok(peakGrowth < MAX_GROWTH_BYTES, `${what}: peak memory grew ${peakGrowth} bytes`);
    }
    const health = await send(server(), 'anonymous', { method: 'GET', path: '/api/health' });
    assert.equal(health.status, 200);
    assert.deepEqual(health.json, { ok: true });
  });

  it('should refuse nesting in indented lists as well as in brackets', async () => {
    // "- " opens a list inside the list before it: 40 of them on one line are 40 levels.
    const yaml = `formula: 1\nid: x\ntitle: x\nkind: mix\nsteps:\n  ${'- '.repeat(40)}x\n`;
    for (const call of yamlCalls(yaml)) {
      const response = await send(server(), 'imke', call);
      assert.equal(response.status, 422, call.path);
      assert.equal(response.json.error.code, 'too-complex', call.path);
      // The keys are level 1, so the 32nd "- " (line 6, column 3 + 2 × 31) opens level 33.
      assert.equal(response.json.error.details[0].line, 6, call.path);
      assert.equal(response.json.error.details[0].column, 65, call.path);
    }
  });

  it('should refuse a formula with more values than any formula has', async () => {
    // 20,000 list items in 40 kB: each one a value, far past the limit of 5,000.
    const yaml = `formula: 1\nid: x\ntitle: x\nkind: mix\nsteps: [${Array(20_000).fill('a').join(',')}]\n`;
    for (const call of yamlCalls(yaml)) {
      const { response, ms } = await measured(() => send(server(), 'imke', call));
      assert.equal(response.status, 422, call.path);
      assert.equal(response.json.error.code, 'too-complex', call.path);
      assert.match(response.json.error.details[0].message, /more than 5,000/, call.path);
      assert.ok(ms < MAX_MS, `${call.path} took ${ms.toFixed(0)} ms`);
    }
  });
});

describe('formula YAML larger than a formula may be', () => {
  const server = suiteServer();

  it('should take a formula of exactly 256 KiB and refuse one byte more with 413 too-large', async () => {
    const largest = paddedFormula(MAX_BYTES);
    assert.equal(Buffer.byteLength(largest), MAX_BYTES);
    const taken = await send(server(), 'imke', yamlCalls(largest)[0]);
    assert.equal(taken.status, 200, taken.text.slice(0, 300));
    assert.equal(taken.json.usable, true);
    for (const call of yamlCalls(paddedFormula(MAX_BYTES + 1))) {
      const response = await send(server(), 'imke', call);
      assert.equal(response.status, 413, `${call.path}: ${response.text.slice(0, 300)}`);
      assert.equal(response.json.error.code, 'too-large', call.path);
      assert.match(response.json.error.details[0].message, /larger than 256 KB/, call.path);
    }
  });

  it('should count the size in bytes: fewer characters than the limit, more bytes, is refused', async () => {
    // "é" is 2 bytes in UTF-8: about 140,000 characters make 280 kB, over the 256 KiB ceiling.
    const yaml = paddedFormula(MAX_BYTES + 20_000, 'é');
    assert.ok(yaml.length < MAX_BYTES);
    for (const call of yamlCalls(yaml)) {
      const response = await send(server(), 'imke', call);
      assert.equal(response.status, 413, call.path);
      assert.equal(response.json.error.code, 'too-large', call.path);
    }
  });

  it('should refuse a formula too large or too deep to create or save, storing nothing', async () => {
    // Reading a formula notes its revision in the history: read it before taking stock.
    const current = await send(server(), 'rosa', {
      method: 'GET',
      path: '/api/formulas/house-sauce',
    });
    const before = await snapshot(server());
    const calls: Call[] = [
      { method: 'POST', path: '/api/formulas', body: { yaml: ATTACK, message: 'deep' } },
      {
        method: 'POST',
        path: '/api/formulas',
        body: { yaml: paddedFormula(MAX_BYTES + 1), message: 'large' },
      },
    ];
    for (const call of calls) {
      const response = await send(server(), 'rosa', call);
      assert.ok([413, 422].includes(response.status), `${call.path}: ${response.status}`);
      assert.ok(['too-large', 'too-complex'].includes(response.json.error.code));
    }
    const saved = await send(server(), 'rosa', {
      method: 'PUT',
      path: '/api/formulas/house-sauce',
      body: { yaml: ATTACK, message: 'deep' },
      headers: { 'if-match': current.headers.get('etag') ?? '' },
    });
    assert.equal(saved.status, 422);
    assert.equal(saved.json.error.code, 'too-complex');
    assert.deepEqual(await snapshot(server()), before);
  });
});
