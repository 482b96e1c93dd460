import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import fc from 'fast-check';
import { type Decimal, dec, sum } from '../../decimal.ts';
import type { MixFormula, MixIngredient } from '../../formula/formula-types.ts';
import { BatchError } from '../batch-error.ts';
import type { CalcResult } from '../calc-result.ts';
import { calculateMix } from './calculate-mix.ts';

/** own example, derived: an aioli with the oil as base. */
function aioli(extra: Partial<MixFormula> = {}): MixFormula {
  return {
    formula: 1,
    id: 'aioli',
    title: 'Garlic aioli',
    kind: 'mix',
    ingredients: [
      { name: 'olive oil', pct: 100, base: true },
      { name: 'egg yolk', pct: 12, raw_egg: true, allergens: ['egg'] },
      { name: 'garlic', pct: 5 },
      { name: 'lemon juice', pct: 6 },
      { name: 'salt', pct: 1.5 },
    ],
    ...extra,
  };
}

/** own example: a dry rub with no egg and no allergen. */
function rub(): MixFormula {
  return {
    formula: 1,
    id: 'rub',
    title: 'Brisket rub',
    kind: 'mix',
    ingredients: [
      { name: 'kosher salt', pct: 100, base: true },
      { name: 'black pepper', pct: 100 },
      { name: 'garlic powder', pct: 25 },
    ],
  };
}

function lineGrams(result: CalcResult): string[] {
  return result.groups[0].lines.map((line) => line.grams.toString());
}

function total(result: CalcResult): Decimal {
  return result.figures.find((f) => f.label === 'Total weight')?.value as Decimal;
}

function batchError(option: string | undefined, pattern: RegExp): (error: unknown) => boolean {
  return (error) => {
    assert.ok(error instanceof BatchError, `not a BatchError: ${String(error)}`);
    assert.equal(error.option, option);
    assert.match(error.message, pattern);
    return true;
  };
}

describe('calculateMix', () => {
  it('should scale an aioli from 2 kg of oil', () => {
    // own example, derived: oil 2000 g (base, 100 %); yolk 2000 × 12 % = 240 g; garlic 5 % =
    // 100 g; lemon 6 % = 120 g; salt 1.5 % = 30 g; total 2000 + 240 + 100 + 120 + 30 = 2490 g.
    const result = calculateMix(aioli(), { base: dec('2000') });
    const group = result.groups[0];
    assert.equal(group.title, 'Mix');
    assert.equal(group.percentOf, 'base');
    assert.deepEqual(lineGrams(result), ['2000', '240', '100', '120', '30']);
    assert.deepEqual(
      group.lines.map((line) => line.percent?.toString()),
      ['100', '12', '5', '6', '1.5'],
    );
    assert.ok(total(result).equals(dec('2490')));
    assert.deepEqual(
      result.inputs.map((f) => f.label),
      ['base: olive oil'],
    );
  });

  it('should find the base from the total: 2490 g of aioli takes 2 kg of oil', () => {
    // own example, derived: Σ pct = 124.5 %, so base = 2490 ÷ 1.245 = 2000 g.
    const result = calculateMix(aioli(), { total: dec('2490') });
    assert.deepEqual(lineGrams(result), ['2000', '240', '100', '120', '30']);
    assert.ok(total(result).equals(dec('2490')));
    assert.deepEqual(
      result.inputs.map((f) => f.label),
      ['Total weight'],
    );
  });

  it('should make the same batch from a total as from the base that gives that total', () => {
    // own example, derived: 1 kg of rub is 1000 ÷ 2.25 = 444.444… g of salt and as much pepper,
    // and 111.111… g of garlic powder.
    const byTotal = calculateMix(rub(), { total: dec('1000') });
    const base = byTotal.groups[0].lines[0].grams;
    assert.equal(base.toFixed(3), '444.444');
    const byBase = calculateMix(rub(), { base });
    assert.deepEqual(lineGrams(byBase), lineGrams(byTotal));
    assert.equal(total(byTotal).toFixed(9), '1000.000000000');
  });

  it('should give the raw-egg, keep-cold, allergen and local-codes cautions in that order', () => {
    const result = calculateMix(aioli(), { base: dec('1000') });
    assert.deepEqual(
      result.cautions.map((c) => c.id),
      ['raw-egg', 'keep-cold', 'allergens', 'local-codes'],
    );
    assert.deepEqual(result.allergens, ['egg']);
  });

  it('should declare egg for a raw-egg ingredient that does not list it', () => {
    const ingredients: MixIngredient[] = [
      { name: 'olive oil', pct: 100, base: true },
      { name: 'egg yolk', pct: 12, raw_egg: true },
    ];
    assert.deepEqual(calculateMix(aioli({ ingredients }), { base: dec('1000') }).allergens, [
      'egg',
    ]);
  });

  it('should give only the local-codes caution to a mix with no egg and no allergen', () => {
    const result = calculateMix(rub(), { base: dec('1000') });
    assert.deepEqual(
      result.cautions.map((c) => c.id),
      ['local-codes'],
    );
    assert.deepEqual(result.allergens, []);
  });

  it('should carry the steps and notes of the formula', () => {
    const result = calculateMix(aioli({ steps: ['Whisk.'], notes: 'Keep 2 days.' }), {
      base: dec('100'),
    });
    assert.deepEqual(result.steps, ['Whisk.']);
    assert.equal(result.notes, 'Keep 2 days.');
    assert.deepEqual(result.formula, { id: 'aioli', title: 'Garlic aioli', kind: 'mix' });
  });

  it('should ask for --base or --total when neither is given', () => {
    assert.throws(
      () => calculateMix(aioli(), {}),
      batchError(undefined, /--base \(weight of olive oil\).*--total/),
    );
  });

  it('should refuse --base and --total together', () => {
    assert.throws(
      () => calculateMix(aioli(), { base: dec('100'), total: dec('200') }),
      batchError('total', /only one of --base or --total/),
    );
  });

  it('should refuse sizes that are not more than 0 g', () => {
    assert.throws(
      () => calculateMix(aioli(), { base: dec('0') }),
      batchError('base', /more than 0/),
    );
    assert.throws(
      () => calculateMix(aioli(), { total: dec('-1') }),
      batchError('total', /more than 0/),
    );
  });

  it('should refuse a formula without exactly one base at 100 %', () => {
    const noBase = aioli({ ingredients: [{ name: 'oil', pct: 100 }] });
    assert.throws(() => calculateMix(noBase, { base: dec('100') }), /0 base ingredients/);
    const offBase = aioli({ ingredients: [{ name: 'oil', pct: 90, base: true }] });
    assert.throws(() => calculateMix(offBase, { base: dec('100') }), /must be at 100 %/);
  });
});

/** Ingredient percentages to the hundredth, 0.01 to 1000 %. */
const percent = fc.integer({ min: 1, max: 100_000 }).map((n) => n / 100);
const others = fc.array(percent, { minLength: 0, maxLength: 12 });
/** A weight to the tenth of a gram, 0.1 g to 100 kg. */
const grams = fc.integer({ min: 1, max: 1_000_000 }).map((n) => dec(n).div(10));
/** A scale factor from 0.1 to 100. */
const factor = fc.integer({ min: 1, max: 1000 }).map((n) => dec(n).div(10));

function mixOf(pcts: number[]): MixFormula {
  return {
    formula: 1,
    id: 'prop',
    title: 'Property mix',
    kind: 'mix',
    ingredients: [
      { name: 'base', pct: 100, base: true },
      ...pcts.map((pct, i) => ({ name: `ingredient ${i}`, pct })),
    ],
  };
}

describe('calculateMix, properties', () => {
  it('should scale every line by exactly k when the base is scaled by k', () => {
    // Short decimals multiply exactly at 40 digits, so no tolerance is needed here.
    fc.assert(
      fc.property(others, grams, factor, (pcts, base, k) => {
        const one = calculateMix(mixOf(pcts), { base }).groups[0].lines;
        const scaled = calculateMix(mixOf(pcts), { base: base.times(k) }).groups[0].lines;
        one.forEach((line, i) => assert.ok(scaled[i].grams.equals(line.grams.times(k))));
      }),
    );
  });

  it('should give back the base that made a total', () => {
    // total = base × Σ pct ÷ 100 exactly, and total × 100 ÷ Σ pct is then exactly the base.
    fc.assert(
      fc.property(others, grams, (pcts, base) => {
        const byBase = calculateMix(mixOf(pcts), { base });
        const byTotal = calculateMix(mixOf(pcts), { total: total(byBase) });
        assert.ok(byTotal.groups[0].lines[0].grams.equals(base));
        assert.ok(sum(byTotal.groups[0].lines.map((l) => l.grams)).equals(total(byBase)));
      }),
    );
  });
});
