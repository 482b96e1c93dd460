import assert from 'node:assert/strict';
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, it, type TestContext } from 'node:test';
import { makeTempDir, writeText } from '../tests/helpers/temp-files.ts';
import { readFormulaFilesOnThreads } from './check-pool.ts';
import { readFormulaFile } from './formula-files.ts';

// Run from source, the pool is given the worker of the built command (`node scripts/build-cli.mjs`).
const BUILT_WORKER = new URL('../dist/cli/check-worker.js', import.meta.url);

/** A worker that dies on the first batch it is sent. */
const DYING_WORKER = new URL(
  "data:text/javascript,import { parentPort } from 'node:worker_threads'; parentPort.on('message', () => process.exit(1));",
);
/** A worker that throws on the first batch it is sent. */
const THROWING_WORKER = new URL(
  "data:text/javascript,import { parentPort } from 'node:worker_threads'; parentPort.on('message', () => { throw new Error('broken'); });",
);

const DEMO_FOLDER = new URL('../formulas/', import.meta.url);

/**
 * 160 files (batches of 10 to 27 on three threads): the demo formulas over and over, a file with
 * errors, and first two dry cures whose `brine` carries a YAML tag (!!set, !!timestamp), refused
 * with its line. A worker must send back the same readings the main thread makes.
 */
function writeFiles(t: TestContext): string[] {
  const dir = makeTempDir(t, 'larder-pool-');
  const demos = readdirSync(DEMO_FOLDER).map((name) =>
    readFileSync(new URL(name, DEMO_FOLDER), 'utf8'),
  );
  const belly = readFileSync(new URL('quillmoor-belly.yaml', DEMO_FOLDER), 'utf8');
  const files = [
    writeText(dir, 'set.yaml', `${belly}brine: !!set { a }\n`),
    writeText(dir, 'date.yaml', `${belly}brine: !!timestamp 2001-12-14\n`),
    writeText(dir, 'broken.yaml', 'formula: 1\nid: [\n'),
  ];
  for (let i = files.length; i < 160; i++)
    files.push(writeText(dir, `f${i}.yaml`, demos[i % demos.length]));
  return files;
}

function assertBuilt(): void {
  assert.ok(
    existsSync(BUILT_WORKER),
    `${fileURLToPath(BUILT_WORKER)} is missing: run \`node scripts/build-cli.mjs\` first`,
  );
}

describe('reading formula files on worker threads', () => {
  it('gives back what the main thread reads, in the order of the files, refused tags and all', async (t) => {
    assertBuilt();
    const files = writeFiles(t);
    const failures: string[] = [];
    const progress: number[] = [];
    const readings = await readFormulaFilesOnThreads(files, {
      threads: 3,
      workerScript: BUILT_WORKER,
      onProgress: (done) => progress.push(done),
      onWorkerFailure: (reason) => failures.push(reason),
    });
    assert.deepEqual(failures, []);
    assert.deepEqual(
      readings,
      files.map((file) => readFormulaFile(file)),
    );
    for (const [i, tag] of ['!!set', '!!timestamp'].entries()) {
      assert.equal(readings[i].formula, undefined);
      assert.match(readings[i].problems[0]?.message ?? '', new RegExp(`YAML tags such as ${tag}`));
    }
    // After each batch, in whatever order they end: a higher count each time, up to every file.
    assert.ok(
      progress.every((done, i) => i === 0 || done > progress[i - 1]),
      String(progress),
    );
    assert.equal(progress.at(-1), files.length);
  });

  for (const [what, workerScript] of [
    ['cannot start', new URL('./no-such-worker.js', import.meta.url)],
    ['dies with a batch in hand', DYING_WORKER],
    ['throws', THROWING_WORKER],
  ] as const) {
    it(`reads every file on the main thread when each worker ${what}`, async (t) => {
      const files = writeFiles(t);
      const failures: string[] = [];
      const readings = await readFormulaFilesOnThreads(files, {
        threads: 3,
        workerScript,
        onWorkerFailure: (reason) => failures.push(reason),
      });
      assert.equal(failures.length, 2, failures.join('\n'));
      assert.deepEqual(
        readings,
        files.map((file) => readFormulaFile(file)),
      );
    });
  }

  it('starts no worker on one thread', async (t) => {
    const files = writeFiles(t);
    const failures: string[] = [];
    const readings = await readFormulaFilesOnThreads(files, {
      threads: 1,
      workerScript: DYING_WORKER,
      onWorkerFailure: (reason) => failures.push(reason),
    });
    assert.deepEqual(failures, []);
    assert.equal(readings.length, files.length);
    assert.equal(path.basename(String(readings[2].problems[0]?.file)), 'broken.yaml');
  });
});
