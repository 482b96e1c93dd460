import assert from 'node:assert/strict';
import { cpSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import {
  REPO_ROOT,
  assertCleanFailure,
  assertExit,
  runLarder,
  stdoutJson,
} from '../helpers/run-larder.ts';
import { makeTempDir } from '../helpers/temp-files.ts';

// Saturated brine: 26.395 % salt, 100 °SAL at 60 °F. source: "The Salometer and How to Use It"
// (meat-processing equipment manual, section 14). The demo brisket brine's salt on 10 kg of meat
// needs about 1.1 kg of water at least; 1 g leaves a brine of about 99.6 % salt.
const THIN = ['calc', 'brisket-brine', '--meat', '10kg', '--water', '0.001kg'];
const REFUSAL =
  /^larder: with 1 g of water, the brine would be \d+\.\d % salt: more than water can dissolve \(26\.395 %, 100 °SAL at 60 °F\); use more water$/m;

describe('larder and a brine stronger than water can dissolve', () => {
  it('should refuse larder calc (exit 2) and record nothing with --record', async (t) => {
    assertCleanFailure(await runLarder(THIN), 2, REFUSAL);
    // With --json the refusal is JSON on stdout.
    const json = await runLarder([...THIN, '--json']);
    assertExit(json, 2);
    assert.match(
      stdoutJson<{ error: { message: string } }>(json).error.message,
      /^with 1 g of water, the brine would be .* more than water can dissolve/,
    );

    const data = path.join(makeTempDir(t), 'data');
    assertExit(
      await runLarder(['users', 'add', 'tobin', '--role', 'cook'], {
        env: { LARDER_DATA: data, LARDER_NEW_PASSWORD: 'tobin-pass-1' },
      }),
      0,
    );
    const env = { LARDER_DATA: data, LARDER_USER: 'tobin', LARDER_PASSWORD: 'tobin-pass-1' };
    assertCleanFailure(await runLarder([...THIN, '--record'], { env }), 2, REFUSAL);
    const list = await runLarder(['batches', 'list', '--json'], { env });
    assertExit(list, 0);
    assert.equal(stdoutJson<{ total: number }>(list).total, 0);
  });

  it('should warn when the brine is close to saturated', async () => {
    // Own example: salt 2.6 % + 0.21 % × 93.75 % = 2.796875 % of meat + water. With 0.88 kg of
    // water: 304.3 g salt ÷ 1184.3 g = 25.69 % = 97.3 °SAL, over the 95 °SAL warning (common
    // practice, no source); with 1 kg: 23.53 % = 89.1 °SAL, no warning.
    const near = await runLarder(['calc', 'brisket-brine', '--meat', '10kg', '--water', '0.88kg']);
    assertExit(near, 0);
    assert.match(near.stdout, /The brine is 25\.7 % salt \(97 °SAL\), close to saturated/);
    const plain = await runLarder(['calc', 'brisket-brine', '--meat', '10kg', '--water', '1kg']);
    assertExit(plain, 0);
    assert.doesNotMatch(plain.stdout, /close to saturated/);
  });

  it('should make larder check fail a formula whose own water cannot dissolve its salt, and larder plan refuse it (exit 3)', async (t) => {
    const dir = makeTempDir(t);
    cpSync(path.join(REPO_ROOT, 'formulas'), dir, { recursive: true });
    const file = path.join(dir, 'brisket-brine.yaml');
    writeFileSync(file, readFileSync(file, 'utf8').replace('water_pct: 60', 'water_pct: 5'));

    const check = await runLarder(['check', file]);
    assertExit(check, 3);
    assert.match(check.stdout + check.stderr, /more than water can dissolve.*raise water_pct/);

    const plan = await runLarder([
      ...['plan', 'corned-beef-sandwich', '--count', '20', '--for', '2026-12-30'],
      ...['--today', '2026-12-02', '--formulas', dir],
    ]);
    assertExit(plan, 3);
    assert.match(plan.stderr, /brisket-brine/);
  });
});
