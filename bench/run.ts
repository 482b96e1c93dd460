// `npm run bench [name…]`: the benchmarks in turn (all by default); each prints its own figures,
// ratio and target. They are measurements, not tests: nothing here fails a build. The machine
// and its load are printed too, since a shared machine's load moves every absolute figure.
import { availableParallelism, cpus, loadavg } from 'node:os';
import { benchBatchLog } from './batch-log.ts';
import { benchCalcApi } from './calc-api.ts';
import { benchCheckMany } from './check-many.ts';
import { benchCliStart } from './cli-start.ts';
import { benchConsoleBundle } from './console-bundle.ts';
import { benchProcessRecords } from './process-records.ts';
import { benchRecall } from './recall.ts';
import { benchRecordBatches } from './record-batches.ts';

/**
 * Runs a benchmark with one server process, then two, and prints the ratio of the two; and the
 * baseline's own ratio where it has one (calc-api's bare route): what this machine lets two
 * processes gain, with the load generator on the same CPUs.
 */
function oneThenTwo(
  bench: (processes: number) => Promise<{ perSecond: number; barePerSecond?: number }>,
): () => Promise<void> {
  return async () => {
    const one = await bench(1);
    const two = await bench(2);
    const bare =
      one.barePerSecond && two.barePerSecond
        ? `; the bare route's own: ${(two.barePerSecond / one.barePerSecond).toFixed(2)} × (${two.barePerSecond.toFixed(0)} against ${one.barePerSecond.toFixed(0)})`
        : '';
    process.stdout.write(
      `  N = 2 against N = 1: ${(two.perSecond / one.perSecond).toFixed(2)} × (${two.perSecond.toFixed(0)} against ${one.perSecond.toFixed(0)} per second)${bare}\n`,
    );
  };
}

const BENCHES: Record<string, () => unknown> = {
  'cli-start': benchCliStart,
  'check-many': benchCheckMany,
  'calc-api': oneThenTwo(benchCalcApi),
  'batch-log': benchBatchLog,
  'record-batches': oneThenTwo(benchRecordBatches),
  'process-records': benchProcessRecords,
  recall: benchRecall,
  'console-bundle': benchConsoleBundle,
};

const load = (): string =>
  loadavg()
    .map((n) => n.toFixed(2))
    .join(' ');

const chosen = process.argv.slice(2);
const unknown = chosen.filter((name) => !(name in BENCHES));
if (unknown.length > 0) {
  process.stderr.write(
    `no benchmark ${unknown.join(', ')}; there are ${Object.keys(BENCHES).join(', ')}\n`,
  );
  process.exit(2);
}
process.stdout.write(
  `Larderbook benchmarks, ${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC: ` +
    `node ${process.version}, ${availableParallelism()} CPUs (${cpus()[0]?.model.trim() ?? 'unknown'})\n`,
);
for (const [name, bench] of Object.entries(BENCHES)) {
  if (chosen.length > 0 && !chosen.includes(name)) continue;
  process.stdout.write(`\n[${name}] load average ${load()}\n`);
  await bench();
}
