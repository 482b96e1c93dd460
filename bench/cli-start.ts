// Benchmark: how long `larder calc` takes to start and answer, against a bare `node -e 0`, in one
// run so that the ratio holds on a busy machine. Prints figures; it is not a test.
import { execFileSync } from 'node:child_process';
import { performance } from 'node:perf_hooks';

const RUNS = Number(process.env.BENCH_RUNS ?? 15);

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

function timeRuns(args: string[]): number {
  const times: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const start = performance.now();
    execFileSync(process.execPath, args, { stdio: 'ignore' });
    times.push(performance.now() - start);
  }
  return median(times);
}

/** Runs the comparison and returns the figures it printed. */
export function benchCliStart(): { nodeMs: number; larderMs: number; ratio: number } {
  // Warm the bundle (and build it if stale) outside the timing.
  execFileSync(process.execPath, ['bin/larder.js', '--version'], { stdio: 'ignore' });
  const nodeMs = timeRuns(['-e', '0']);
  const larderMs = timeRuns([
    'bin/larder.js',
    'calc',
    'quillmoor-belly',
    '--meat',
    '4.26kg',
    '--thickness',
    '4cm',
  ]);
  const ratio = larderMs / nodeMs;
  process.stdout.write(
    `CLI start (median of ${RUNS}): node -e 0 ${nodeMs.toFixed(1)} ms, larder calc ${larderMs.toFixed(1)} ms, ratio ${ratio.toFixed(2)} (target ≤ 3)\n`,
  );
  return { nodeMs, larderMs, ratio };
}
