import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { dec } from '../../decimal.ts';
import { COMMON_YEAST_FACTORS } from '../../reference/yeast-factors.ts';
import { BatchError } from '../batch-error.ts';
import type { LineGroup } from '../calc-result.ts';
import { calculateDough } from './calculate-dough.ts';
import {
  bunDough,
  doughFormula,
  figure,
  figureValue as value,
  gramsByName as grams,
  groupTotal,
  leanDough,
  POOLISH,
  poolishDough,
} from './dough-fixtures.ts';

describe('calculating a dough batch', () => {
  it('should weigh 73 pieces of 390 g of a 170 % dough to the worksheet figures', () => {
    // source: course worksheet, pieces × piece weight (issuing school not identified)
    const result = calculateDough(leanDough(), { pieces: 73, piece: dec(390) });
    assert.equal(result.groups.length, 1);
    const [dough] = result.groups;
    assert.equal(dough.title, 'Dough');
    assert.equal(dough.percentOf, "total flour (baker's %)");
    assert.equal(dough.totalLabel, 'Dough');
    assert.deepEqual(grams(dough, 2), {
      'Bread flour': '16747.06',
      Water: '11220.53',
      Salt: '334.94',
      Yeast: '167.47',
    });
    assert.equal(groupTotal(dough).toFixed(2), '28470.00');
    assert.deepEqual(
      result.portions && [result.portions.count, result.portions.remainderGrams.toString()],
      [73, '0'],
    );
    assert.equal(result.checks.length, 0);
  });

  it('should weigh 48 buns of 80 g with no loss to the worked example', () => {
    // own example, derived: the bun formula (182.8 %) by baker's percent, no loss
    const [dough] = calculateDough(bunDough(), { pieces: 48, piece: dec(80) }).groups;
    assert.deepEqual(grams(dough, 3), {
      'Bread flour': '2100.656',
      'Whole milk': '1050.328',
      'Whole egg': '210.066',
      Butter: '210.066',
      Honey: '105.033',
      Water: '105.033',
      'Instant yeast': '21.007',
      Salt: '37.812',
    });
    assert.equal(groupTotal(dough).toFixed(3), '3840.000');
  });

  it('should weigh 48 buns of 80 g with 2 % loss, divide convention, to the worked example', () => {
    // own example, derived: the bun formula, 2 % loss divided out as in "Bread Formula
    // Construction" (2011): ÷ 0.98
    const result = calculateDough(bunDough(), { pieces: 48, piece: dec(80), loss: dec(2) });
    const [dough] = result.groups;
    assert.deepEqual(grams(dough, 3), {
      'Bread flour': '2143.527',
      'Whole milk': '1071.763',
      'Whole egg': '214.353',
      Butter: '214.353',
      Honey: '107.176',
      Water: '107.176',
      'Instant yeast': '21.435',
      Salt: '38.583',
    });
    assert.equal(value(result, 'Mixed dough').toFixed(3), '3918.367');
    assert.equal(result.portions?.pieceGrams.toString(), '80');
    assert.equal(result.portions?.count, 48);
    assert.equal(result.portions?.remainderGrams.toFixed(3), '78.367');
    const loss = result.inputs.find((f) => f.label === 'Loss allowance');
    assert.equal(loss?.kind, 'percent');
    assert.match(loss?.note ?? '', /÷ \(1 − loss\/100\)/);
  });

  it('should report effective hydration with USDA water contents and plain-water hydration', () => {
    // source: USDA National Nutrient Database for Standard Reference, Release 26, field Water_(g);
    // own example, derived: (50×0.8813 + 10×0.7615 + 10×0.1587 + 5×0.171 + 5×1) / 100 = 59.122 %
    const result = calculateDough(bunDough(), { flour: dec(1000) });
    assert.equal(figure(result, 'Effective hydration')?.value.toString(), '59.122');
    assert.match(
      figure(result, 'Effective hydration')?.note ?? '',
      /flour's own moisture .* not counted/,
    );
    assert.equal(figure(result, 'Hydration (plain water only)')?.value.toString(), '5');
    assert.equal(figure(result, 'Total formula')?.value.toString(), '182.8');
  });

  it('should give cautions, allergens, steps and notes', () => {
    const result = calculateDough(bunDough({ steps: ['Mix', 'Bake'], notes: 'Soft rolls.' }), {
      flour: dec(1000),
    });
    assert.deepEqual(
      result.cautions.map((caution) => caution.id),
      ['raw-dough', 'raw-egg', 'allergens', 'local-codes'],
    );
    assert.deepEqual(result.allergens, ['milk', 'egg', 'wheat']);
    assert.deepEqual(result.steps, ['Mix', 'Bake']);
    assert.equal(result.notes, 'Soft rolls.');
    assert.deepEqual(result.formula, { id: 'test-dough', title: 'Test dough', kind: 'dough' });
  });

  it('should leave out the raw-egg caution when no ingredient is raw egg', () => {
    const ids = calculateDough(leanDough(), { flour: dec(1000) }).cautions.map(
      (caution) => caution.id,
    );
    assert.deepEqual(ids, ['raw-dough', 'allergens', 'local-codes']);
  });

  it('should refuse a batch without a size, or with two', () => {
    assert.throws(() => calculateDough(leanDough(), {}), BatchError);
    assert.throws(
      () => calculateDough(leanDough(), { total: dec(1000), flour: dec(600) }),
      BatchError,
    );
  });

  it('should refuse a formula whose flours do not add up to 100 %', () => {
    const formula = doughFormula([
      { name: 'Bread flour', pct: 90, flour: true },
      { name: 'Water', pct: 65 },
    ]);
    assert.throws(() => calculateDough(formula, { flour: dec(1000) }), /exactly 100 %/);
  });
});

describe('calculating a dough with a preferment', () => {
  it('should give the preferment, the final dough and the overall formula', () => {
    // own example, derived: 1000 g flour, 30 % poolish
    const result = calculateDough(poolishDough(), { flour: dec(1000) });
    assert.deepEqual(
      result.groups.map((group) => [group.title, group.percentOf]),
      [
        ['Preferment: Poolish', 'preferment flour'],
        ['Final dough', "total flour (baker's %)"],
        ['Overall formula (reference)', "total flour (baker's %)"],
      ],
    );
    const [preferment, final, overall] = result.groups;
    assert.deepEqual(grams(preferment, 1), {
      'Bread flour': '300.0',
      Water: '300.0',
      'Fresh yeast': '0.9',
    });
    assert.deepEqual(grams(final, 1), {
      'Bread flour': '700.0',
      Water: '400.0',
      Salt: '20.0',
      'Fresh yeast': '14.1',
      Poolish: '600.9',
    });
    assert.equal(final.lines.at(-1)?.role, 'preferment');
    assert.equal(final.lines.at(-1)?.percent?.toString(), '60.09');
    assert.equal(groupTotal(final).toString(), groupTotal(overall).toString());
    assert.equal(groupTotal(overall).toString(), '1735');
    assert.equal(figure(result, 'Preferment flour')?.value.toString(), '300');
  });

  it('should convert the yeast in every group when asked', () => {
    // source: professional bread-baking text, "Yeast conversions: fresh to dry" (title and
    // edition not confirmed): instant = 0.33 × fresh
    const result = calculateDough(poolishDough(), { flour: dec(1000), yeast: 'instant' });
    const [preferment, final, overall] = result.groups;
    const yeast = (group: LineGroup) => group.lines.find((line) => line.name === 'Instant yeast');
    assert.equal(yeast(preferment)?.grams.toString(), '0.297');
    assert.equal(yeast(preferment)?.percent?.toString(), '0.099');
    assert.equal(yeast(final)?.grams.toString(), '4.653');
    assert.equal(yeast(overall)?.grams.toString(), '4.95');
    assert.match(yeast(final)?.note ?? '', /converted from 14\.1 g fresh yeast/);
    assert.equal(
      final.lines.find((line) => line.role === 'preferment')?.grams.toString(),
      '600.297',
    );
    assert.equal(groupTotal(final).toString(), groupTotal(overall).toString());
    assert.ok(
      result.warnings.some((warning) => /changes the mixed dough by -10\.1 g/.test(warning)),
    );
    assert.deepEqual(
      result.inputs.filter((f) => f.label === 'Yeast').map((f) => f.value),
      ['instant yeast'],
    );
  });

  it('should convert with the common set when asked to', () => {
    // common practice, no source: active dry = 0.5 × fresh
    const result = calculateDough(
      leanDough(),
      { flour: dec(1000), yeast: 'active-dry' },
      { yeastFactors: COMMON_YEAST_FACTORS },
    );
    assert.equal(
      result.groups[0].lines.find((line) => line.name === 'Active dry yeast')?.grams.toString(),
      '5',
    );
  });

  it('should refuse a preferment that needs more than the overall formula holds', () => {
    assert.throws(
      () => calculateDough(poolishDough({ ...POOLISH, flour_pct: 80 }), { flour: dec(1000) }),
      /more Water than the whole batch has/,
    );
  });
});
