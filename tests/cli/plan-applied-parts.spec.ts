import assert from 'node:assert/strict';
import { cpSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import type { PresentedPlan } from '../../shared/index.ts';
import {
  REPO_ROOT,
  assertCleanFailure,
  assertExit,
  runLarder,
  stdoutJson,
} from '../helpers/run-larder.ts';
import { makeTempDir, writeText } from '../helpers/temp-files.ts';

const SANDWICH = [
  ...['plan', 'corned-beef-sandwich', '--count', '60'],
  ...['--for', '2026-12-18', '--today', '2026-12-02'],
];

describe('larder plan: the rub goes on the brisket', () => {
  it('should make the rub by the day the brisket comes out of the brine, from its green weight', async () => {
    const run = await runLarder([...SANDWICH, '--json']);
    assertExit(run, 0);
    const plan = stdoutJson<PresentedPlan>(run);
    const batch = (id: string) => plan.batches.find((b) => b.formula.id === id);
    // Brisket: hold 1.5 days/cm × 5 cm + 1 = 8.5 → 9 days, then its 2 lead days (soak out and
    // dry, rub and smoke, rest): 11 days before 18 Dec → 7 Dec, out of the brine 16 Dec.
    // source: the demo formula's own hold rule and lead days (common practice, no source)
    assert.equal(batch('brisket-brine')?.start, '2026-12-07');
    assert.equal(batch('brisket-brine')?.ready, '2026-12-16');
    // The rub goes on when the brisket comes out of the brine, before smoking: made 16 Dec,
    // not on the day of service.
    assert.equal(batch('brisket-rub')?.start, '2026-12-16');
    assert.deepEqual(batch('brisket-rub')?.goesOn, [
      {
        formula: { id: 'brisket-brine', title: 'Brisket flat, equilibrium brine' },
        date: '2026-12-16',
      },
    ]);
    assert.deepEqual(batch('brisket-brine')?.gets, [
      {
        formula: { id: 'brisket-rub', title: 'Beef rub, salt and pepper forward' },
        date: '2026-12-16',
      },
    ]);
    // 60 × 140 g = 8 400 g sliced ÷ (0.82 × 0.92) = 11 134.6766 g green; the rub is 1.5 % of
    // that: 167.0201 g (by hand, bc: 8400/(0.82*0.92)*0.015).
    assert.equal(batch('brisket-rub')?.batch.total?.slice(0, 8), '167.0201');
    assert.deepEqual(
      plan.days.map((day) => day.date),
      ['2026-12-07', '2026-12-16', '2026-12-17', '2026-12-18'],
    );
  });

  it('should print what goes on the brisket and when, under each of the two batches', async () => {
    const run = await runLarder(SANDWICH);
    assertExit(run, 0);
    assert.match(
      run.stdout,
      /\n {2}2026-12-16 {2}Beef rub, salt and pepper forward \(mix\), goes on Brisket flat, equilibrium brine\n/,
    );
    assert.match(
      run.stdout,
      /Brisket flat, equilibrium brine \(brisket-brine · cure\)\n(.*\n)*? {2}Gets: Beef rub, salt and pepper forward on 2026-12-16, when it comes out of its hold\n/,
    );
    assert.match(
      run.stdout,
      /Beef rub, salt and pepper forward \(brisket-rub · mix\)\n(.*\n)*? {2}Goes on: Brisket flat, equilibrium brine on 2026-12-16, when it comes out of its hold\n/,
    );
  });

  it('should refuse, at its line, a rub applied to a part that is not in the sandwich', async (t) => {
    const dir = makeTempDir(t);
    cpSync(path.join(REPO_ROOT, 'formulas'), dir, { recursive: true });
    writeText(
      dir,
      'loose-rub.yaml',
      'formula: 1\nid: loose-rub\ntitle: Loose rub\nkind: assembly\ncomponents:\n' +
        '  - { formula: pit-bun, pieces: 1 }\n' +
        '  - { formula: brisket-rub, on: brisket-brine, pct: 1.5 }\n',
    );
    const run = await runLarder([
      'plan',
      path.join(dir, 'loose-rub.yaml'),
      '--count',
      '10',
      '--for',
      '2026-12-18',
      '--today',
      '2026-12-02',
    ]);
    assertCleanFailure(
      run,
      3,
      /brisket-rub goes on brisket-brine, which is not a part of this assembly/,
    );
    // The "on" key of the second component: line 7, column 29.
    assert.match(run.stderr, /loose-rub\.yaml:7:29: error: brisket-rub goes on brisket-brine/);
  });
});
