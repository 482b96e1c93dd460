// `npm run bench [name…]`: the benchmarks in turn (all by default); each prints its own figures,
// ratio and target. They are measurements, not tests: nothing here fails a build.
import { benchBatchLog } from './batch-log.ts';
import { benchCalcApi } from './calc-api.ts';
import { benchCliStart } from './cli-start.ts';

const BENCHES: Record<string, () => unknown> = {
  'cli-start': benchCliStart,
  'calc-api': benchCalcApi,
  'batch-log': benchBatchLog,
};

const chosen = process.argv.slice(2);
for (const [name, bench] of Object.entries(BENCHES)) {
  if (chosen.length === 0 || chosen.includes(name)) await bench();
}
