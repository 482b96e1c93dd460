import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../../shared/decimal.ts';
import type {
  PresentedFigure,
  PresentedGroup,
  PresentedLine,
  PresentedResult,
} from '../../shared/index.ts';
import { assertCleanFailure, assertExit, runLarder, stdoutJson } from '../helpers/run-larder.ts';
import { writeMix } from '../helpers/temp-files.ts';

/** Runs `larder calc … --json` and returns the result, asserting exit 0 and a quiet stderr. */
async function calcJson(...args: string[]): Promise<PresentedResult> {
  const run = await runLarder(['calc', ...args, '--json']);
  assertExit(run, 0);
  assert.equal(run.stderr, '');
  return stdoutJson<PresentedResult>(run);
}

/** The figure (input or computed) whose label matches, case-insensitively. */
function figure(figures: readonly PresentedFigure[], label: RegExp): PresentedFigure {
  const found = figures.filter((f) => label.test(f.label));
  assert.equal(
    found.length,
    1,
    `one figure matching ${label} in: ${figures.map((f) => f.label).join(', ')}`,
  );
  return found[0];
}

function group(result: PresentedResult, title: RegExp): PresentedGroup {
  const found = result.groups.find((g) => title.test(g.title));
  assert.ok(found, `a group matching ${title} in: ${result.groups.map((g) => g.title).join(', ')}`);
  return found;
}

function line(lines: readonly PresentedLine[], name: RegExp): PresentedLine {
  const found = lines.filter((l) => name.test(l.name));
  assert.equal(
    found.length,
    1,
    `one line matching ${name} in: ${lines.map((l) => l.name).join(', ')}`,
  );
  return found[0];
}

/** An exact decimal string rounded half-up to some places, for values that do not terminate. */
function places(exact: string | undefined, n: number): string {
  assert.ok(exact !== undefined, 'an exact value');
  return new Decimal(exact).toDecimalPlaces(n).toFixed(n);
}

/** Adds exact decimal strings. */
function total(values: readonly string[]): Decimal {
  return values.reduce((sum, value) => sum.plus(value), new Decimal(0));
}

describe('larder calc on a dough (pit-bun, 48 pieces of 90 g, 3 % loss)', () => {
  const args = ['pit-bun', '--pieces', '48', '--piece', '90g', '--loss', '3'];

  it('makes enough dough for the pieces after the loss, dividing by (1 − loss)', async () => {
    const result = await calcJson(...args);
    assert.equal(result.formula.kind, 'dough');
    assert.equal(figure(result.inputs, /^pieces$/i).exact, '48');
    assert.equal(figure(result.inputs, /^piece weight$/i).exact, '90');
    assert.equal(figure(result.inputs, /^loss allowance$/i).exact, '3');
    const mixed = figure(result.figures, /^mixed dough$/i).exact;
    // 48 × 90 g ÷ (1 − 0.03) = 4320 ÷ 0.97 = 4453.608… g.
    // source: The Bakery Network, "Bread Formula Construction" (2011), loss divided out by (1 − loss)
    assert.equal(places(mixed, 3), '4453.608');
    // Not the multiply convention: 4320 × 1.03 = 4449.6 g. own example, derived
    assert.notEqual(places(mixed, 1), '4449.6');
  });

  it('works out the total flour from the sum of the baker’s percentages', async () => {
    const result = await calcJson(...args);
    // The formula's percentages add up to 100 + 28 + 30 + 10 + 10 + 6 + 1.2 + 1.8 = 187 %;
    // flour = 4453.608… ÷ 1.87 = 2381.609 g; 30 % of it goes into the sponge = 714.483 g.
    // own example, derived (baker's percentage: every ingredient as % of total flour)
    assert.equal(figure(result.figures, /^total formula$/i).exact, '187');
    assert.equal(places(figure(result.figures, /^total flour$/i).exact, 3), '2381.609');
    assert.equal(places(figure(result.figures, /^preferment flour$/i).exact, 3), '714.483');
  });

  it('weighs the final dough and the sponge to the same dough weight', async () => {
    const result = await calcJson(...args);
    const finalDough = group(result, /^final dough$/i);
    const mixed = figure(result.figures, /^mixed dough$/i).exact;
    assert.ok(finalDough.total, 'the final dough has a total');
    // The exact lines add up to the mixed dough. own example, derived
    assert.equal(
      places(total(finalDough.lines.map((l) => l.grams)).toString(), 9),
      places(mixed, 9),
    );
    // Bread flour in the final dough is what the sponge did not take: 70 % of 2381.609 g = 1667.126 g.
    // own example, derived
    assert.equal(places(line(finalDough.lines, /^bread flour$/).grams, 3), '1667.126');
  });

  it('divides into 48 pieces and leaves the loss allowance over', async () => {
    const result = await calcJson(...args);
    assert.equal(result.portions?.count, 48);
    // own example, derived: 4453.608 g − 48 × 90 g = 133.608 g
    assert.equal(places(result.portions?.remainderGrams, 3), '133.608');
  });

  it('says on the sheet that what is over is the loss allowance, in its own words', async () => {
    const run = await runLarder(['calc', ...args]);
    assertExit(run, 0);
    // 4453.608 − 4320 = 133.608 g = 3 % of 4453.608 g: the allowance, not spare dough.
    // source: The Bakery Network, "Bread Formula Construction" (2011): the sheet names
    // the convention in its own words, not by the handbook's title
    assert.match(run.stdout, /48 × 90\.0 g; the other \d+(\.\d)? g is the loss allowance \(3 %\)/);
    assert.doesNotMatch(run.stdout, /left over/);
    assert.match(run.stdout, /loss taken out of the mixed dough/);
    assert.doesNotMatch(run.stdout, /Bread Formula Construction/);
  });

  it('brings the milk and egg to the liquid temperature, not only the water', async () => {
    const result = await calcJson(
      ...args,
      ...['--room', '24C', '--flour-temp', '22C', '--preferment-temp', '18C', '--tap', '15C'],
    );
    // 4 × 26 − (24 + 22 + 18) − 22 °F × 5/9 = 104 − 64 − 12.222 = 27.778 °C, printed to 0.5 °C.
    // source: San Francisco Baking Institute, Artisan I workshop reference material (2009); the
    // friction factor, a difference, takes only the 5/9 factor in °C; own example, derived
    assert.equal(places(figure(result.figures, /^liquid temperature$/i).exact, 3), '27.778');
    assert.equal(figure(result.figures, /^bring whole milk and whole egg to$/i).value, '28.0 °C');
    assert.equal(figure(result.figures, /^water temperature$/i).value, '28.0 °C');
    // The tap (15 °C) is colder than 27.8 °C: no ice.
    assert.ok(!result.groups.some((g) => g.lines.some((l) => l.role === 'ice')));
  });

  it('refuses a blend option on a dough', async () => {
    const run = await runLarder(['calc', ...args, '--target-fat', '20']);
    assertCleanFailure(run, 2, /^larder: --target-fat does not apply to a dough formula$/m, {
      oneLine: true,
    });
  });
});

describe('larder calc on a blend (chuck-grind: 15 % and 50 % fat trims to 20 % fat)', () => {
  it('splits 20 kg by the Pearson square', async () => {
    const result = await calcJson('chuck-grind', '--total', '20kg');
    const meat = group(result, /^meat$/i);
    const lean = line(meat.lines, /^chuck trim/);
    const fat = line(meat.lines, /^brisket fat trim/);
    // Parts: lean 50 − 20 = 30, fat 20 − 15 = 5, of 35; 20 kg × 30/35 = 17.143 kg and
    // 20 kg × 5/35 = 2.857 kg. source: Pearson square as in meat-evaluation training material
    // ("Meat Calculations" presentation, issuer not identified)
    assert.equal(places(lean.grams, 3), '17142.857');
    assert.equal(places(fat.grams, 3), '2857.143');
    assert.equal(lean.amount, '17.143 kg');
    // In a block of 10 kg or more every 1 g line reads in kilograms. source: the product brief
    assert.equal(fat.amount, '2.857 kg');
    // The two exact amounts add up to the batch. own example, derived
    assert.equal(places(total([lean.grams, fat.grams]).toString(), 9), '20000.000000000');
    assert.equal(meat.total?.grams, '20000');
    // source: Pearson square, as above: the blend comes out at the target
    assert.equal(places(figure(result.figures, /^blend fat$/i).exact, 9), '20.000000000');
  });

  it('passes the ground-beef fat ceiling at 20 % fat', async () => {
    const result = await calcJson('chuck-grind', '--total', '20kg');
    const check = result.checks.find((c) => c.id.startsWith('fat-standard'));
    assert.ok(check, 'a fat-standard check');
    // source: 9 CFR 319.15(a), ground beef at most 30 % fat
    assert.equal(check.limit, '30 %');
    assert.equal(check.status, 'pass');
    assert.equal(result.critical, false);
  });

  it('works the fat trim out from the lean on hand', async () => {
    const result = await calcJson('chuck-grind', '--on-hand', 'lean=12kg');
    const meat = group(result, /^meat$/i);
    // fat trim = 12 kg × (20 − 15)/(50 − 20) = 2 kg; batch 14 kg.
    // source: Pearson square as in meat-evaluation training material (issuer not identified)
    assert.equal(line(meat.lines, /^chuck trim/).grams, '12000');
    assert.equal(line(meat.lines, /^brisket fat trim/).grams, '2000');
    assert.equal(figure(result.figures, /^total batch weight$/i).exact, '14000');
    assert.equal(figure(result.figures, /^blend fat$/i).exact, '20');
  });

  it('takes --on-hand for each trimming, refusing all of them fixed with the reason', async () => {
    const run = await runLarder([
      'calc',
      'chuck-grind',
      '--on-hand',
      'lean=12kg',
      '--on-hand',
      'fat=2kg',
    ]);
    // derived from the mass and fat balances: one free trimming is needed to size the batch
    assertCleanFailure(run, 2, /every trimming is fixed by what is on hand/, { oneLine: true });
  });

  it('uses a fat test measured today instead of the formula’s figure, and says so', async () => {
    const result = await calcJson('chuck-grind', '--total', '20kg', '--fat-test', 'lean=18');
    const meat = group(result, /^meat$/i);
    // source: Pearson square (meat-evaluation training material) with the lean trim measured
    // at 18 %: parts 50 − 20 = 30 and 20 − 18 = 2 of 32; 20 kg × 30/32 = 18.75 kg, the fat
    // trim 1.25 kg.
    assert.equal(line(meat.lines, /^chuck trim 85\/15 \(18 % fat, measured\)$/).grams, '18750');
    assert.equal(line(meat.lines, /^brisket fat trim/).grams, '1250');
    assert.match(figure(result.inputs, /^fat test: chuck trim/i).note ?? '', /formula's 15 %/);
  });

  it('refuses a target outside the two trims with exit 2', async () => {
    const run = await runLarder(['calc', 'chuck-grind', '--total', '20kg', '--target-fat', '10']);
    // source: Pearson square: a blend of two trims lies between their fat contents (15 % and 50 %)
    assertCleanFailure(run, 2, /10 % fat cannot be made from trimmings at 15 % and 50 % fat/, {
      oneLine: true,
    });
  });

  it('refuses an on-hand key the formula does not have', async () => {
    const run = await runLarder(['calc', 'chuck-grind', '--on-hand', 'brisket=12kg']);
    assertExit(run, 2);
    assert.match(run.stderr, /brisket/);
    assert.ok(!run.stderr.includes('    at '));
  });

  it('a blend at exactly the fat ceiling passes whatever the batch size', async () => {
    for (const size of ['3kg', '17kg', '50kg']) {
      const result = await calcJson('chuck-grind', '--total', size, '--target-fat', '30');
      const check = result.checks.find((c) => c.id.startsWith('fat-standard'));
      // source: 9 CFR 319.15(a), at most 30 % fat: 30 % itself is within the limit
      assert.equal(check?.status, 'pass', `${size}: ${check?.sentence}`);
    }
  });
});

describe('larder calc on a mix', () => {
  it('scales the rub from 1 kg of the base ingredient', async () => {
    const result = await calcJson('brisket-rub', '--base', '1kg');
    const mix = result.groups[0];
    // own example, derived: each line is its pct of 1000 g of kosher salt (100, 90, 25, 12, 3 %)
    assert.deepEqual(
      mix.lines.map((l) => [l.name, l.grams]),
      [
        ['kosher salt', '1000'],
        ['16-mesh black pepper', '900'],
        ['granulated garlic', '250'],
        ['sweet paprika', '120'],
        ['cayenne', '30'],
      ],
    );
    // own example, derived: 1000 × 230 % = 2300 g
    assert.equal(mix.total?.grams, '2300');
    assert.equal(figure(result.figures, /^total weight$/i).exact, '2300');
  });

  it('scales the sauce to a 2 kg total', async () => {
    const result = await calcJson('house-sauce', '--total', '2kg');
    const mix = result.groups[0];
    // The percentages add up to 100 + 25 + 8 + 3 + 1.5 + 0.8 + 0.5 = 138.8 %, so the base is
    // 2000 g ÷ 1.388 = 1440.922 g. own example, derived
    assert.equal(places(line(mix.lines, /^mayonnaise/).grams, 3), '1440.922');
    assert.equal(places(total(mix.lines.map((l) => l.grams)).toString(), 9), '2000.000000000');
    assert.equal(mix.total?.grams, '2000');
    // The printed total adds up the printed lines (1441 + 360 + 115 + 43.2 + 21.6 + 11.5 + 7.2 =
    // 1999.5 g). source: formulas/README.md "Numbers on the sheet" (totals add up the printed
    // lines)
    const printed = total(mix.lines.map((l) => l.amount.replace(/ g$/, '')));
    assert.equal(mix.total?.amount, `${printed.toFixed(1)} g`);
    // Egg (mayonnaise) and anchovy (Worcestershire sauce), named as the law words them.
    // source: 21 U.S.C. 343(w)(2) (the species of fish); formulas/house-sauce.yaml
    assert.deepEqual(result.allergens, ['egg', 'fish (anchovy)']);
    assert.ok(
      result.cautions.some((c) => /anchovy/.test(c.text)),
      'the formula’s own caution is printed',
    );
  });

  it('prints soy as soybeans and a tree nut with its kind on the sheet', async (t) => {
    const file = writeMix(t, 'glaze', [
      '  - { name: honey, pct: 100, base: true }',
      '  - { name: soy sauce, pct: 10, allergens: [wheat, soy] }',
      '  - { name: chopped pecans, pct: 20, allergens: [{ tree-nuts: pecan }] }',
    ]);
    const run = await runLarder(['calc', file, '--base', '1kg']);
    assertExit(run, 0);
    // source: 21 U.S.C. 321(qq)(1) ("tree nuts", "wheat", "soybeans") and 343(w)(2) (the type
    // of tree nut is named)
    assert.match(run.stdout, /Contains: tree nuts \(pecan\), wheat, soybeans\./);
  });

  it('refuses a cure option on a mix', async () => {
    const run = await runLarder(['calc', 'house-sauce', '--total', '2kg', '--meat', '2kg']);
    assertCleanFailure(run, 2, /^larder: --meat does not apply to a mix formula$/m, {
      oneLine: true,
    });
  });
});
