// Benchmark: `larder check` over 2,000 generated formula files in one run, in milliseconds per
// file (target under 1 ms: the schema is compiled ahead of time and every file read once).
// Beside it, in the same run: `larder check` of one file (the process start and fixed cost, so
// the cost of each further file can be told apart), and a bare process that only parses the same
// files with the yaml package — the floor for any check that reads them with it.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';

const FILES = Number(process.env.BENCH_CHECK_FILES ?? 2000);
const RUNS = Number(process.env.BENCH_CHECK_RUNS ?? 3);

// Reads every file of a folder and parses it as larder check does (positions kept for messages).
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

/** Median wall time of running node with these arguments, in ms; returns the last output too. */
function timeNode(args: string[], runs: number): { ms: number; output: string } {
  const times: number[] = [];
  let output = '';
  for (let i = 0; i < runs; i++) {
    const start = performance.now();
    try {
      output = execFileSync(process.execPath, args, { maxBuffer: 256 * 1024 * 1024 }).toString();
    } catch (error) {
      // Exit code 3 (a formula with errors) still prints the report.
      output = String((error as { stdout?: Buffer }).stdout ?? '');
    }
    times.push(performance.now() - start);
  }
  return { ms: median(times), output };
}

/** Writes copies of the demo formulas with their own ids, checks them all, prints ms per file. */
export function benchCheckMany(): { msPerFile: number } {
  const folder = mkdtempSync(path.join(tmpdir(), 'larder-check-'));
  try {
    const demos = readdirSync('formulas')
      .filter((name) => name.endsWith('.yaml'))
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

    const all = timeNode(['bin/larder.js', 'check', folder, '--json'], RUNS);
    const one = timeNode(['bin/larder.js', 'check', first, '--json'], RUNS + 2);
    const yamlOnly = timeNode(['--input-type=module', '-e', YAML_ONLY, folder], RUNS);
    const bare = timeNode(['-e', '0'], RUNS + 2);

    const { summary } = JSON.parse(all.output) as { summary: { files: number; ok: number } };
    const msPerFile = all.ms / summary.files;
    const beyondStart = (all.ms - one.ms) / (summary.files - 1);
    const yamlPerFile = (yamlOnly.ms - bare.ms) / summary.files;
    process.stdout.write(
      `larder check over ${summary.files} files (${summary.ok} ok; median of ${RUNS} runs)\n` +
        `  ${all.ms.toFixed(0)} ms in all: ${msPerFile.toFixed(3)} ms per file, process start included (target < 1 ms)\n` +
        `  each file beyond the first: ${beyondStart.toFixed(3)} ms (larder check of one file: ${one.ms.toFixed(0)} ms)\n` +
        `  parsing the same files with the yaml package alone: ${yamlPerFile.toFixed(3)} ms per file; ` +
        `larder check is ${(beyondStart / yamlPerFile).toFixed(2)}× that\n`,
    );
    return { msPerFile };
  } finally {
    rmSync(folder, { recursive: true, force: true });
  }
}
