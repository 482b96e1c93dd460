import assert from 'node:assert/strict';
import { copyFileSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { today } from '../../cli/io.ts';
import type { PresentedCheck, PresentedLine, PresentedResult } from '../../shared/index.ts';
import {
  REPO_ROOT,
  assertCleanFailure,
  assertExit,
  runLarder,
  showRun,
  stdoutJson,
} from '../helpers/run-larder.ts';
import { makeTempDir, writeText } from '../helpers/temp-files.ts';
import { bellyCalc } from '../helpers/cli-belly.ts';

// Today on this machine's clock (a start must lie within a year of it), and 8 days on, counted on
// the calendar here: 2 days per cm × 4 cm (the formula's own rule).
const START = today();
const READY = new Date(Date.parse(`${START}T00:00:00Z`) + 8 * 86_400_000)
  .toISOString()
  .slice(0, 10);
const BELLY = bellyCalc(START, 'formulas/quillmoor-belly.yaml');
const REFUSED = [
  'calc',
  'maple-pump-belly',
  '--meat',
  '10kg',
  '--pumped-weight',
  '11.2kg',
  '--start',
  START,
];
const REFUSED_BANNER = '*** REFUSED: a critical limit is failed. Do not make this batch. ***';

function curingSaltLine(result: PresentedResult): PresentedLine {
  const lines = result.groups
    .flatMap((group) => group.lines)
    .filter((line) => line.role === 'curing-salt');
  assert.equal(lines.length, 1, 'one curing-salt line');
  return lines[0];
}

function checkById(result: PresentedResult, id: string): PresentedCheck {
  const check = result.checks.find((c) => c.id === id);
  assert.ok(check, `a check "${id}" in ${result.checks.map((c) => c.id).join(', ')}`);
  return check;
}

describe('larder calc on a dry-cured bacon (quillmoor-belly, 4.26 kg, 4 cm)', () => {
  it('prints the batch sheet with the curing salt, the nitrite check and the ready date', async () => {
    const run = await runLarder(BELLY);
    assertExit(run, 0);
    assert.equal(run.stderr, '');
    // own example, derived: 4260 g × 0.25 % = 10.65 g, rounded half-up to 0.1 g = 10.7 g.
    // source: rounding rule from the product brief (curing salt weighed to 0.1 g, half-up)
    assert.match(
      run.stdout,
      /^\s+curing salt no\. 1 \(6\.25 % nitrite\)\s+0\.25 %\s+10\.7 g\s+← curing salt$/m,
    );
    // 10.65 g × 6.25 % × 1 000 000 / 4260 g = 156.25 ppm, printed to 0.1 ppm = 156.3.
    // source: USDA FSIS Directive 7620.3, ch. 3 (comminuted/dry formula); limit 200 ppm for
    // dry-cured bacon: 9 CFR 424.22(b)
    assert.match(
      run.stdout,
      /^\s+PASS\s+Ingoing sodium nitrite: 156\.3 ppm is within the 200 ppm limit for dry-cured bacon/m,
    );
    // own example, derived from the formula's own rule: 2 days per cm × 4 cm = 8 days
    // (over its 7-day minimum), ready 8 days after the start
    assert.match(run.stdout, /^\s+8 days: /m);
    assert.match(run.stdout, new RegExp(`Start ${START}\\s+→\\s+ready ${READY}`));
    assert.ok(!run.stdout.includes('REFUSED'), showRun(run));
  });

  it('gives the same batch as JSON with exact values as strings', async () => {
    const run = await runLarder([...BELLY, '--json']);
    assertExit(run, 0);
    assert.equal(run.stderr, '');
    const result = stdoutJson<PresentedResult>(run);

    assert.equal(result.formula.id, 'quillmoor-belly');
    assert.equal(result.formula.kind, 'cure');
    assert.equal(result.units, 'metric');
    assert.ok(result.groups.length > 0);
    for (const group of result.groups) {
      assert.equal(typeof group.title, 'string');
      for (const line of group.lines) {
        assert.equal(typeof line.amount, 'string', line.name);
        assert.equal(typeof line.grams, 'string', line.name);
        assert.match(line.grams, /^\d+(\.\d+)?$/, `${line.name}: grams is an exact decimal string`);
      }
    }
    for (const check of result.checks) {
      assert.ok(['pass', 'fail', 'warn'].includes(check.status), check.id);
      assert.ok(['PASS', 'FAIL', 'WARN'].includes(check.verdict), check.id);
      assert.equal(typeof check.exact, 'string', check.id);
    }
    assert.equal(result.critical, false);
    assert.ok(result.cautions.length > 0);
    assert.ok(result.cautions.every((c) => typeof c.text === 'string' && c.text.length > 0));
    assert.equal(typeof result.rounding, 'string');
    assert.match(result.rounding, /half-up/);

    const salt = curingSaltLine(result);
    // own example, derived: 4260 g × 0.25 % = 10.65 g exactly, weighed as 10.7 g (half-up to 0.1 g;
    // source: product brief)
    assert.equal(salt.grams, '10.65');
    assert.equal(salt.amount, '10.7 g');
    assert.equal(salt.percent, '0.25 %');

    const nitrite = checkById(result, 'nitrite-max');
    // 10.65 g × 6.25 % × 1 000 000 / 4260 g = 156.25 ppm. source: USDA FSIS Directive 7620.3, ch. 3
    assert.equal(nitrite.exact, '156.25');
    assert.equal(nitrite.value, '156.3 ppm');
    // source: 9 CFR 424.22(b), dry-cured bacon 200 ppm
    assert.equal(nitrite.limit, '200 ppm');
    assert.equal(nitrite.status, 'pass');
    assert.equal(nitrite.verdict, 'PASS');
    assert.equal(nitrite.critical, true);

    // own example, derived: 2 days per cm × 4 cm = 8 days (the formula's own rule)
    assert.equal(result.schedule?.days, 8);
    assert.equal(result.schedule?.start, START);
    assert.equal(result.schedule?.ready, READY);
  });

  it('finds the formula by id in ./formulas and gives the same figures', async () => {
    const run = await runLarder(['calc', 'quillmoor-belly', ...BELLY.slice(2), '--json']);
    assertExit(run, 0);
    const result = stdoutJson<PresentedResult>(run);
    assert.equal(result.formula.id, 'quillmoor-belly');
    // own example, derived: 4260 g × 0.25 % = 10.65 g
    assert.equal(curingSaltLine(result).grams, '10.65');
  });
});

describe('larder calc in US units', () => {
  it('weighs the curing salt in ounces with the gram figure beside it', async () => {
    const run = await runLarder([...BELLY, '--units', 'us']);
    assertExit(run, 0);
    // own example, derived: 10.65 g ÷ 28.349523125 g/oz = 0.3757 oz → 0.4 oz (half-up to 0.1 oz),
    // with 10.65 g → 10.7 g beside it. source: NIST SP 811 (2008) App. B.8, 1 oz = 453.59237 g / 16
    assert.match(
      run.stdout,
      /^\s+curing salt no\. 1 \(6\.25 % nitrite\)\s+0\.25 %\s+0\.4 oz\s+\(10\.7 g\) ← curing salt$/m,
    );
    assert.match(run.stdout, /· US units/);
  });

  it('keeps the exact grams in JSON and shows ounces as the amount', async () => {
    const run = await runLarder([...BELLY, '--units', 'us', '--json']);
    assertExit(run, 0);
    const result = stdoutJson<PresentedResult>(run);
    assert.equal(result.units, 'us');
    const salt = curingSaltLine(result);
    // own example, derived: see the test above (0.3757 oz → 0.4 oz; 10.65 g → 10.7 g)
    assert.equal(salt.amount, '0.4 oz');
    assert.equal(salt.gramsShown, '10.7 g');
    assert.equal(salt.grams, '10.65');
    // own example, derived: 4260 g ÷ 28.349523125 = 150.267 oz = 9 lb 6.267 oz → 9 lb 6.3 oz.
    // source: NIST SP 811 (2008) App. B.8
    assert.equal(result.inputs.find((f) => f.label === 'Green weight')?.value, '9 lb 6.3 oz');
    // The nitrite figure does not depend on the units. source: USDA FSIS Directive 7620.3, ch. 3
    assert.equal(checkById(result, 'nitrite-max').exact, '156.25');
  });

  it('reads pounds and ounces on the command line', async () => {
    const run = await runLarder([
      'calc',
      'quillmoor-belly',
      '--meat',
      '9 lb 6 oz',
      '--thickness',
      '1.5in',
      '--json',
    ]);
    assertExit(run, 0);
    const result = stdoutJson<PresentedResult>(run);
    // own example, derived: 9 × 453.59237 g + 6 × 28.349523125 g = 4252.42846875 g.
    // source: NIST SP 811 (2008) App. B.8, 1 lb = 453.59237 g exactly
    assert.equal(result.inputs.find((f) => f.label === 'Green weight')?.exact, '4252.42846875');
  });

  it('prints US units by default when LARDER_UNITS=us', async () => {
    const run = await runLarder([...BELLY, '--json'], { env: { LARDER_UNITS: 'us' } });
    assertExit(run, 0);
    assert.equal(stdoutJson<PresentedResult>(run).units, 'us');
  });
});

describe('larder calc looks formulas up by id', () => {
  it('uses --formulas DIR and finds the id inside a file named otherwise', async (t) => {
    const dir = makeTempDir(t);
    copyFileSync(
      path.join(REPO_ROOT, 'formulas/quillmoor-belly.yaml'),
      path.join(dir, 'house-bacon-2026.yaml'),
    );
    const run = await runLarder(
      ['calc', 'quillmoor-belly', '--formulas', dir, '--meat', '4.26kg', '--json'],
      { cwd: dir },
    );
    assertExit(run, 0);
    const result = stdoutJson<PresentedResult>(run);
    assert.equal(result.formula.id, 'quillmoor-belly');
    // own example, derived: 4260 g × 0.25 % = 10.65 g
    assert.equal(curingSaltLine(result).grams, '10.65');
  });

  it('uses $LARDER_FORMULAS when there is no --formulas', async (t) => {
    const dir = makeTempDir(t);
    copyFileSync(
      path.join(REPO_ROOT, 'formulas/quillmoor-belly.yaml'),
      path.join(dir, 'quillmoor-belly.yaml'),
    );
    const run = await runLarder(['calc', 'quillmoor-belly', '--meat', '4.26kg', '--json'], {
      cwd: dir,
      env: { LARDER_FORMULAS: dir },
    });
    assertExit(run, 0);
    assert.equal(stdoutJson<PresentedResult>(run).formula.id, 'quillmoor-belly');
  });

  it('says the formulas folder is missing when run where there is none', async (t) => {
    const dir = makeTempDir(t);
    const run = await runLarder(['calc', 'quillmoor-belly', '--meat', '4.26kg'], { cwd: dir });
    assertCleanFailure(
      run,
      3,
      /no formula "quillmoor-belly": the formulas folder formulas does not exist/,
      { oneLine: true },
    );
  });

  it('an id names the formula holding that id, not a file that happens to be named like it', async (t) => {
    const dir = makeTempDir(t);
    const belly = readFileSync(path.join(REPO_ROOT, 'formulas/quillmoor-belly.yaml'), 'utf8');
    const rub = readFileSync(path.join(REPO_ROOT, 'formulas/brisket-rub.yaml'), 'utf8');
    // belly-v2.yaml holds id house-bacon; rub.yaml holds id belly-v2.
    writeText(dir, 'belly-v2.yaml', belly.replace(/^id: quillmoor-belly$/m, 'id: house-bacon'));
    writeText(dir, 'rub.yaml', rub.replace(/^id: brisket-rub$/m, 'id: belly-v2'));
    const run = await runLarder(['calc', 'belly-v2', '--formulas', dir, '--base', '1kg', '--json']);
    assertExit(run, 0);
    assert.equal(stdoutJson<PresentedResult>(run).formula.id, 'belly-v2');
  });
});

describe('larder calc refuses a batch over a critical limit (maple-pump-belly pumped to 12 %)', () => {
  it('exits 4, says REFUSED and prints no amounts to weigh', async () => {
    const run = await runLarder(REFUSED);
    assertExit(run, 4);
    assert.match(run.stdout, /REFUSED/);
    assert.equal(
      run.stdout.trimEnd().split('\n').at(-1),
      REFUSED_BANNER,
      'the banner closes the sheet too',
    );
    assert.match(run.stdout, /critical limit exceeded/);
    // own example, derived: (11.2 kg − 10 kg) / 10 kg = 12 % pump; the brine is made for 10 %,
    // where 0.192 % curing salt × 6.25 % × 10^6 = 120 ppm, so at 12 %: 120 × 12/10 = 144 ppm.
    // source: USDA FSIS Directive 7620.3, ch. 3 (pumped-product formula); limit 120 ppm for pumped
    // bacon: 9 CFR 424.22(b)
    assert.match(
      run.stdout,
      /FAIL\s+Ingoing sodium nitrite: critical limit exceeded: 144\.0 ppm is over the 120 ppm limit for pumped bacon/,
    );
    assert.ok(!/^WEIGH/m.test(run.stdout), `no weigh section on a refused sheet:\n${run.stdout}`);
    assert.ok(!run.stdout.includes('← curing salt'), 'no curing-salt line');
    assert.ok(!/^HOLD/m.test(run.stdout), 'no hold or ready date');
  });

  it('says critical true in JSON and still exits 4', async () => {
    const run = await runLarder([...REFUSED, '--json']);
    assertExit(run, 4);
    assert.equal(run.stderr, '');
    const result = stdoutJson<PresentedResult>(run);
    assert.equal(result.critical, true);
    const nitrite = checkById(result, 'nitrite-max');
    // own example, derived: 120 × 12/10 = 144 ppm; limit source: 9 CFR 424.22(b)
    assert.equal(nitrite.exact, '144');
    assert.equal(nitrite.limit, '120 ppm');
    assert.equal(nitrite.status, 'fail');
    assert.equal(nitrite.verdict, 'FAIL');
    assert.equal(nitrite.critical, true);
    // Nothing to weigh reaches a script either: a refused batch carries no amounts.
    assert.deepEqual(result.groups, []);
    assert.equal(result.yields, undefined);
  });

  it('passes at exactly the limit: pumped to the formula’s own 10 %', async () => {
    const run = await runLarder([
      'calc',
      'maple-pump-belly',
      '--meat',
      '10kg',
      '--pumped-weight',
      '11kg',
      '--json',
    ]);
    assertExit(run, 0);
    const result = stdoutJson<PresentedResult>(run);
    // own example, derived: 0.192 % × 6.25 % × 10^6 = 120 ppm, and the limit is "at most" 120 ppm.
    // source: 9 CFR 424.22(b)
    assert.equal(checkById(result, 'nitrite-max').exact, '120');
    assert.equal(checkById(result, 'nitrite-max').status, 'pass');
    assert.equal(result.critical, false);
  });

  it('shows the unrounded figure when rounding would hide the excess', async () => {
    const run = await runLarder([
      'calc',
      'maple-pump-belly',
      '--meat',
      '10kg',
      '--pumped-weight',
      '11.0004kg',
    ]);
    assertExit(run, 4);
    // own example, derived: 1000.4 g / 10 000 g = 10.004 % pump; 120 × 10.004/10 = 120.048 ppm,
    // which prints as 120.0 ppm. source: formulas/README.md "Numbers on the sheet" (unrounded
    // figure shown); limit: 9 CFR 424.22(b)
    assert.match(
      run.stdout,
      /120\.0 ppm \(120\.048 unrounded\) is over the 120 ppm limit for pumped bacon/,
    );
  });
});

describe('larder calc refuses a batch that fails a critical check that is not a ceiling', () => {
  it('exits 4 for pumped bacon under-pumped below its 550 ppm erythorbate', async () => {
    const run = await runLarder([
      'calc',
      'maple-pump-belly',
      '--meat',
      '5kg',
      '--pumped-weight',
      '5.47kg',
      '--start',
      START,
    ]);
    assertExit(run, 4);
    assert.equal(run.stdout.trimEnd().split('\n').at(-1), REFUSED_BANNER);
    // own example, derived: (5.47 − 5) / 5 = 9.4 % pump; the brine is made for 10 %, where its
    // 0.055 % erythorbate is 550 ppm, so at 9.4 %: 550 × 9.4/10 = 517 ppm, short of the 550 ppm
    // pumped bacon must carry. source: 9 CFR 424.22(b); FSIS 7620.3 ch. 3 (pumped formula)
    assert.match(
      run.stdout,
      /FAIL\s+Sodium ascorbate or erythorbate: critical limit not met: 517\.0 ppm is below the 550 ppm required for pumped bacon/,
    );
    assert.ok(!run.stdout.includes('← curing salt'), 'no curing-salt line');
  });

  it('exits 4 for a pumped bacon formula that carries no erythorbate at all', async (t) => {
    const dir = makeTempDir(t);
    const file = writeText(
      dir,
      'bare-pump-bacon.yaml',
      [
        'formula: 1',
        'id: bare-pump-bacon',
        'title: Pumped bacon without erythorbate',
        'kind: cure',
        'method: pump',
        'product: bacon',
        'species: pork',
        'brine: { pump_pct: 10 }',
        'ingredients:',
        '  - { name: salt, pct: 1.5, salt: 100 }',
        '  - { name: curing salt, pct: 0.192, nitrite: 6.25, salt: 93.75 }',
        '',
      ].join('\n'),
    );
    const run = await runLarder(['calc', file, '--meat', '5kg']);
    // Every batch of it is refused, so the refusal's exit, not a broken file's.
    // source: 9 CFR 424.22(b): pumped bacon must carry 550 ppm ascorbate or erythorbate
    assertExit(run, 4);
    assert.match(run.stderr, /REFUSED/);
    assert.match(run.stderr, /critical limit not met: sodium ascorbate or erythorbate 0\.0 ppm/);
  });
});

describe('larder calc on the hot links at the label rate (0.25 % of a 6.25 % curing salt)', () => {
  it('passes: 156.25 ppm is exactly ¼ oz per 100 lb of chopped meat', async () => {
    const run = await runLarder(['calc', 'hot-link-cure', '--meat', '10kg', '--json']);
    assertExit(run, 0);
    const result = stdoutJson<PresentedResult>(run);
    const nitrite = checkById(result, 'nitrite-max');
    // source: 9 CFR 424.21(c) "¼ oz to 100 lb chopped meat": 0.25 / 1600 × 10^6 = 156.25 ppm; the
    // batch: 0.25 % × 6.25 % × 10^6 = 156.25 ppm (USDA FSIS Directive 7620.3, ch. 3)
    assert.equal(nitrite.exact, '156.25');
    assert.equal(nitrite.limit, '156.25 ppm');
    assert.equal(nitrite.status, 'pass');
    assert.match(
      nitrite.sentence,
      /^156\.3 ppm \(156\.25 unrounded\) is within the 156\.25 ppm limit \(¼ oz per 100 lb chopped meat\)/,
    );
    // 10 000 g × 0.25 % = 25 g of curing salt, to 0.1 g
    assert.equal(curingSaltLine(result).amount, '25.0 g');
    assert.equal(result.critical, false);
  });
});
