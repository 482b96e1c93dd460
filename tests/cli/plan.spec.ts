import assert from 'node:assert/strict';
import { cpSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { today } from '../../cli/io.ts';
import { addDays, type PresentedPlan } from '../../shared/index.ts';
import {
  REPO_ROOT,
  assertCleanFailure,
  assertExit,
  localCook,
  runLarder,
  stdoutJson,
} from '../helpers/run-larder.ts';
import { makeTempDir, writeText } from '../helpers/temp-files.ts';

const BURGER = ['plan', 'smokehouse-burger', '--count', '120', '--for', '2026-12-18'];
const TODAY = ['--today', '2026-12-02'];

/** A copy of the demo formulas with more files in it. */
function libraryWith(t: { after(fn: () => unknown): void }, files: Record<string, string>) {
  const dir = makeTempDir(t);
  cpSync(path.join(REPO_ROOT, 'formulas'), dir, { recursive: true });
  for (const [name, text] of Object.entries(files)) writeText(dir, name, text);
  return dir;
}

const assembly = (id: string, part: string): string =>
  `formula: 1\nid: ${id}\ntitle: ${id}\nkind: assembly\ncomponents:\n  - ${part}\n`;

describe('larder plan', () => {
  it('should print each start day, the pull list and the allergens of 120 burgers', async () => {
    const run = await runLarder([...BURGER, ...TODAY]);
    assertExit(run, 0);
    // The belly holds 2 days per cm × 4 cm = 8 days, then 2 lead days (rinse and dry overnight,
    // smoke and chill overnight): 18 Dec − 10 = 8 Dec. The bun's sponge is mixed the evening
    // before: 17 Dec. Grind and sauce are made on the day. source: the demo formulas' hold rule
    // and lead days (common practice, no source)
    assert.match(run.stdout, /2026-12-08 {2}Quillmoor belly/);
    assert.match(run.stdout, /2026-12-17 {2}Milk and honey bun/);
    assert.match(
      run.stdout,
      /2026-12-18 {2}Pit-house sandwich sauce \(mix\); Smokehouse burger grind/,
    );
    // 120 × 3 slices × 25 g = 9000 g sliced; through yields of 90 % (smoke) and 94 % (slice):
    // 9000 ÷ 0.90 ÷ 0.94 = 10 638.30 g of green belly, printed 10.638 kg (kg from 10 kg).
    assert.match(run.stdout, /green meat for Quillmoor belly, dry equilibrium cure +10\.638 kg/);
    // Salt: 2.25 % × 10 638.30 g (belly) + 1.8 % × 5 954.02 g flour (bun) = 239.36 + 107.17
    // = 346.53 g, weighed to 1 g: 347 g, used by both.
    assert.match(run.stdout, /fine sea salt +347 g +quillmoor-belly, pit-bun/);
    // Milk and butter (bun), egg (bun, mayonnaise), anchovy (Worcestershire), wheat (flour).
    // source: FALCPA 2004 major allergens, the species of fish named as 21 U.S.C. 343(w)(2)
    // asks, as declared in the demo formulas
    assert.match(run.stdout, /ALLERGENS\n {2}milk, egg, fish \(anchovy\), wheat\n/);
    assert.match(run.stdout, /Curing salt is poisonous/);
  });

  it('should give the plan as JSON with exact grams', async () => {
    const run = await runLarder([...BURGER, ...TODAY, '--json']);
    assertExit(run, 0);
    const plan = stdoutJson<PresentedPlan>(run);
    assert.deepEqual(plan.days, [
      { date: '2026-12-08', formulas: ['quillmoor-belly'] },
      { date: '2026-12-17', formulas: ['pit-bun'] },
      { date: '2026-12-18', formulas: ['house-sauce', 'chuck-grind'] },
    ]);
    const curingSalt = plan.pullList.find((item) => item.name.startsWith('curing salt'));
    // 0.25 % × 10 638.297 g = 26.5957 g. source: the formula's 0.25 % of green weight
    assert.equal(curingSalt?.grams.slice(0, 7), '26.5957');
    assert.equal(curingSalt?.amount, '26.6 g');
    assert.deepEqual(plan.allergens, ['milk', 'egg', 'fish (anchovy)', 'wheat']);
  });

  it('should refuse a service day too soon for the longest batch, naming it and the earliest day', async () => {
    const run = await runLarder([
      'plan',
      'smokehouse-burger',
      '--count',
      '120',
      '--for',
      '2026-12-05',
      ...TODAY,
    ]);
    // 5 Dec − (8 hold + 2 lead) days = 25 Nov; 2 Dec + 10 days = 12 Dec.
    assertCleanFailure(
      run,
      2,
      /Quillmoor belly, dry equilibrium cure must start 25 Nov 2026, already past/,
    );
    assert.match(run.stderr, /earliest service this plan can make is 12 Dec 2026/);
  });

  it('should refuse a batch formula, a missing part and a circle of assemblies', async (t) => {
    assertCleanFailure(
      await runLarder(['plan', 'chuck-grind', '--count', '1', '--for', '2026-12-18']),
      2,
      /chuck-grind is a blend, not an assembly/,
    );
    const dir = libraryWith(t, {
      'lost.yaml': assembly('lost', '{ formula: no-such-thing, amount: 10 g }'),
      'loop-a.yaml': assembly('loop-a', '{ formula: loop-b, units: 1 }'),
      'loop-b.yaml': assembly('loop-b', '{ formula: loop-a, units: 1 }'),
    });
    const lost = await runLarder([
      'plan',
      path.join(dir, 'lost.yaml'),
      '--count',
      '1',
      '--for',
      '2026-12-25',
      ...TODAY,
    ]);
    assertCleanFailure(lost, 3, /no formula "no-such-thing"/);
    assert.match(lost.stderr, /lost\.yaml:6:7: error/);
    const loop = await runLarder([
      'plan',
      path.join(dir, 'loop-a.yaml'),
      '--count',
      '1',
      '--for',
      '2026-12-25',
      ...TODAY,
    ]);
    assertCleanFailure(loop, 3, /loop-a → loop-b → loop-a goes round in a circle/);
  });

  it('should refuse counts and dates it cannot use', async () => {
    for (const [count, date, message] of [
      ['0', '2026-12-18', /the count must be a whole number from 1 to 100000, not 0/],
      ['12.5', '2026-12-18', /--count takes a whole number/],
      ['120', '18/12/2026', /--for takes a date written YYYY-MM-DD/],
    ] as const) {
      const run = await runLarder([
        'plan',
        'smokehouse-burger',
        '--count',
        count,
        '--for',
        date,
        ...TODAY,
      ]);
      assertCleanFailure(run, 2, message);
    }
  });

  it('should record every batch of the plan as planned, on its start day', async (t) => {
    const env = await localCook(t);
    // A recorded plan starts from this machine's today: --today is refused with --record.
    const pretend = await runLarder([...BURGER, ...TODAY, '--record'], { env });
    assertCleanFailure(pretend, 2, /--today cannot be used with --record/);
    // Far enough ahead for the belly's 8 hold days and its 2 days of smoking and chilling.
    const service = addDays(today(), 16);
    const recorded = await runLarder(
      ['plan', 'smokehouse-burger', '--count', '120', '--for', service, '--record', '--json'],
      { env },
    );
    assertExit(recorded, 0);
    const { batches } = stdoutJson<{
      batches: { lotCode: string; status: string; startedOn: string }[];
    }>(recorded);
    // Belly 8 + 2 days before service, the bun 1 day before, grind and sauce on the day, and
    // the burgers themselves on the day. source: the demo formulas' hold and lead days
    const belly = addDays(service, -10);
    assert.deepEqual(
      batches.map((b) => `${b.startedOn} ${b.status}`),
      [belly, addDays(service, -1), service, service, service].map((day) => `${day} planned`),
    );
    // Lot codes carry the start day. source: our lot code format (server/README.md "Batches")
    assert.ok(batches[0].lotCode.startsWith(`${belly.slice(2).replaceAll('-', '')}-`));
    const list = await runLarder(['batches', 'list', '--status', 'planned', '--json'], { env });
    assertExit(list, 0);
    assert.equal(stdoutJson<{ items: unknown[] }>(list).items.length, 5);
  });
});
