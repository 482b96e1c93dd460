import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { today } from '../../cli/io.ts';
import { addDays } from '../../shared/index.ts';
import {
  assertCleanFailure,
  assertExit,
  localCook,
  runLarder,
  stdoutJson,
} from '../helpers/run-larder.ts';
import { PASSWORDS, startTestServer } from '../helpers/test-server.ts';

type Run = Awaited<ReturnType<typeof runLarder>>;

/** The lots a recorded plan printed as JSON. */
const lotsOf = (run: Run): string[] =>
  stdoutJson<{ batches: { lotCode: string }[] }>(run).batches.map((b) => b.lotCode);

/** 120 burgers, far enough ahead for the belly's 8 hold days and 2 of smoking and chilling. */
const burgers = (): string[] => [
  ...['plan', 'smokehouse-burger', '--count', '120'],
  ...['--for', addDays(today(), 16)],
];

/**
 * Records 120 burgers for a service day twice, then with --again: the second time is refused
 * with the lots already there, the third records new batches. `where` is the server's options.
 */
async function recordTwiceThenAgain(env: Record<string, string>, where: string[]): Promise<void> {
  const plan = burgers();
  const first = await runLarder([...plan, '--record', ...where, '--json'], { env });
  assertExit(first, 0);
  const lots = lotsOf(first);
  // Belly, bun, grind and sauce, and the burgers' own batch for the day of service.
  // source: formulas/smokehouse-burger.yaml
  assert.equal(lots.length, 5);

  const twice = await runLarder([...plan, '--record', ...where], { env });
  assertCleanFailure(twice, 2, /5 batches are already recorded for Smokehouse burger on /);
  for (const lot of lots) assert.match(twice.stderr, new RegExp(`lot ${lot} `));
  assert.match(twice.stderr, /give --again to record new batches for it as well/);
  assert.doesNotMatch(twice.stderr, /\{"/, 'no JSON in the words');

  const again = await runLarder([...plan, '--record', '--again', ...where, '--json'], { env });
  assertExit(again, 0);
  const more = lotsOf(again);
  assert.equal(more.length, 5);
  assert.deepEqual(
    more.filter((lot) => lots.includes(lot)),
    [],
    'new batches, with lots of their own',
  );
}

describe('larder plan --record --again', () => {
  it('should refuse a plan recorded before on this machine, naming its lots, unless --again', async (t) => {
    await recordTwiceThenAgain(await localCook(t), []);
  });

  it('should do the same on a server', async (t) => {
    const server = await startTestServer(t);
    await recordTwiceThenAgain({ LARDER_USER: 'tobin', LARDER_PASSWORD: PASSWORDS.tobin }, [
      '--server',
      server.url,
    ]);
  });

  it('should take --again only with --record', async () => {
    const run = await runLarder([...burgers(), '--again']);
    assertCleanFailure(run, 2, /--again goes with --record/);
  });
});
