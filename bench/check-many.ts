// Benchmark: `larder check` over 2,000 generated formula files in one run, in milliseconds per
// file (target under 1 ms: the schema is compiled ahead of time, every file read once, and the
// files shared out among worker threads, one per CPU). Beside it, in the same run: the same
// check on one thread (LARDER_CHECK_THREADS=1), `larder check` of one file (the process start and
// fixed cost, so the cost of each further file can be told apart), and a bare process that only
// parses the same files with the yaml package — the floor for any check on one thread.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { checkThreads, threadsSetting } from '../cli/check-threads.ts';
import { isFormulaFileName } from '../shared/index.ts';

const FILES = Number(process.env.BENCH_CHECK_FILES ?? 2000);
const RUNS = Number(process.env.BENCH_CHECK_RUNS ?? 3);

// Reads every file of a folder and parses it as larder check does (positions kept for messages).
// It calls the yaml package bare, without the size and nesting check larder check makes first:
// it is the floor, and its files are copies of the demo formulas, far inside the limits.
const YAML_ONLY = `
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { LineCounter, parseDocument } from 'yaml';
const folder = process.argv[1];
for (const name of readdirSync(folder).sort())
  parseDocument(readFileSync(path.join(folder, name), 'utf8'), {
    lineCounter: new LineCounter(),
    uniqueKeys: true,
  }).toJS({ maxAliasCount: 50 });
`;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

/** A node process to time: its arguments, and variables to add to the environment. */
interface NodeRun {
  args: string[];
  env?: Record<string, string>;
}

/**
 * Median wall time of each run, in ms, with the last output of each. The runs take turns, so
 * that a change of load on a shared machine falls on all of them alike.
 */
function timeNodes(runs: NodeRun[], times: number): { ms: number; output: string }[] {
  const results = runs.map(() => ({ times: [] as number[], output: '' }));
  for (let i = 0; i < times; i++) {
    runs.forEach(({ args, env }, r) => {
      const start = performance.now();
      try {
        results[r].output = execFileSync(process.execPath, args, {
          env: { ...process.env, ...env },
          maxBuffer: 256 * 1024 * 1024,
        }).toString();
      } catch (error) {
        // Exit code 3 (a formula with errors) still prints the report.
        results[r].output = String((error as { stdout?: Buffer }).stdout ?? '');
      }
      results[r].times.push(performance.now() - start);
    });
  }
  return results.map(({ times: taken, output }) => ({ ms: median(taken), output }));
}

/** Writes copies of the demo formulas with their own ids, checks them all, prints ms per file. */
export function benchCheckMany(): { msPerFile: number } {
  const folder = mkdtempSync(path.join(tmpdir(), 'larder-check-'));
  try {
    const demos = readdirSync('formulas')
      .filter(isFormulaFileName)
      .map((name) => readFileSync(path.join('formulas', name), 'utf8'))
      // An assembly names other formulas by id, which the renamed copies no longer carry.
      .filter((text) => !/^kind: assembly$/m.test(text));
    for (let i = 0; i < FILES; i++) {
      const text = demos[i % demos.length]
        .replace(/^id: (.+)$/m, `id: $1-${i}`)
        .replace(/^# yaml-language-server.*\n/, '');
      writeFileSync(path.join(folder, `f${String(i).padStart(5, '0')}.yaml`), text);
    }
    const first = path.join(folder, 'f00000.yaml');
    // Build the bundle if stale, outside the timing.
    execFileSync(process.execPath, ['bin/larder.js', '--version'], { stdio: 'ignore' });

    const check = ['bin/larder.js', 'check', folder, '--json'];
    const [all, oneThread, yamlOnly] = timeNodes(
      [
        { args: check },
        { args: check, env: { LARDER_CHECK_THREADS: '1' } },
        { args: ['--input-type=module', '-e', YAML_ONLY, folder] },
      ],
      RUNS,
    );
    const [one, bare] = timeNodes(
      [{ args: ['bin/larder.js', 'check', first, '--json'] }, { args: ['-e', '0'] }],
      RUNS + 2,
    );

    const { summary } = JSON.parse(all.output) as { summary: { files: number; ok: number } };
    const threads = checkThreads(summary.files, threadsSetting());
    const msPerFile = all.ms / summary.files;
    const beyondStart = (all.ms - one.ms) / (summary.files - 1);
    const oneThreadBeyond = (oneThread.ms - one.ms) / (summary.files - 1);
    const yamlPerFile = (yamlOnly.ms - bare.ms) / summary.files;
    process.stdout.write(
      `larder check over ${summary.files} files (${summary.ok} ok; median of ${RUNS} runs) ` +
        `on ${threads} thread(s), ${availableParallelism()} CPUs\n` +
        `  ${all.ms.toFixed(0)} ms in all: ${msPerFile.toFixed(3)} ms per file, process start included (target < 1 ms)\n` +
        `  each file beyond the first: ${beyondStart.toFixed(3)} ms (larder check of one file: ${one.ms.toFixed(0)} ms)\n` +
        `  on one thread (LARDER_CHECK_THREADS=1): ${oneThread.ms.toFixed(0)} ms, ${(oneThread.ms / summary.files).toFixed(3)} ms per file, ` +
        `${oneThreadBeyond.toFixed(3)} ms each beyond the first; ${(oneThread.ms / all.ms).toFixed(2)}× the time on ${threads}\n` +
        `  parsing the same files with the yaml package alone, on one thread: ${yamlPerFile.toFixed(3)} ms per file; ` +
        `larder check on one thread is ${(oneThreadBeyond / yamlPerFile).toFixed(2)}× that\n`,
    );
    return { msPerFile };
  } finally {
    rmSync(folder, { recursive: true, force: true });
  }
}
