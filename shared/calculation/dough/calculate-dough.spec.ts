import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { dec, sum } from '../../decimal.ts';
import { COMMON_YEAST_FACTORS } from '../../reference/yeast-factors.ts';
import { parseTemperature, parseTemperatureDifference } from '../../units/temperature.ts';
import { BatchError } from '../batch-error.ts';
import type { CalcResult, LineGroup } from '../calc-result.ts';
import { calculateDough } from './calculate-dough.ts';
import { bunDough, doughFormula, leanDough, POOLISH, poolishDough } from './dough-fixtures.ts';

const grams = (group: LineGroup, places: number) =>
  Object.fromEntries(group.lines.map((line) => [line.name, line.grams.toFixed(places)]));
const groupTotal = (group: LineGroup) => sum(group.lines.map((line) => line.grams));
const figure = (result: CalcResult, label: string) => result.figures.find((f) => f.label === label);
const groupNamed = (result: CalcResult, title: string) => {
  const found = result.groups.find((group) => group.title === title);
  assert.ok(found, `no group "${title}"`);
  return found;
};

describe('calculating a dough batch', () => {
  it('should weigh 73 pieces of 390 g of a 170 % dough to the worksheet figures', () => {
    // source: course worksheet, pieces × piece weight (issuing school not identified; WE-14)
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
    assert.deepEqual(result.portions && [result.portions.count, result.portions.remainderGrams.toString()], [73, '0']);
    assert.equal(result.checks.length, 0);
  });

  it('should weigh 48 buns of 80 g with no loss to the worked example', () => {
    // own example, derived (WE-16, no loss)
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
    // own example, derived (WE-16, 2 % loss, divide by 0.98)
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
    assert.equal(figure(result, 'Mixed dough')?.value.toString().slice(0, 8), '3918.367');
    assert.equal(result.portions?.pieceGrams.toString(), '80');
    assert.equal(result.portions?.count, 48);
    assert.equal(result.portions?.remainderGrams.toFixed(3), '78.367');
    const loss = result.inputs.find((f) => f.label === 'Loss allowance');
    assert.equal(loss?.kind, 'percent');
    assert.match(loss?.note ?? '', /divide convention/);
  });

  it('should report effective hydration with USDA water contents and plain-water hydration', () => {
    // source: USDA National Nutrient Database for Standard Reference, Release 26, field Water_(g);
    // own example, derived: (50×0.8813 + 10×0.7615 + 10×0.1587 + 5×0.171 + 5×1) / 100 = 59.122 %
    const result = calculateDough(bunDough(), { flour: dec(1000) });
    assert.equal(figure(result, 'Effective hydration')?.value.toString(), '59.122');
    assert.match(figure(result, 'Effective hydration')?.note ?? '', /flour's own moisture .* not counted/);
    assert.equal(figure(result, 'Hydration (plain water only)')?.value.toString(), '5');
    assert.equal(figure(result, 'Total formula')?.value.toString(), '182.8');
  });

  it('should give cautions, allergens, steps and notes', () => {
    const result = calculateDough(bunDough({ steps: ['Mix', 'Bake'], notes: 'Soft rolls.' }), { flour: dec(1000) });
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
    const ids = calculateDough(leanDough(), { flour: dec(1000) }).cautions.map((caution) => caution.id);
    assert.deepEqual(ids, ['raw-dough', 'allergens', 'local-codes']);
  });

  it('should refuse a batch without a size, or with two', () => {
    assert.throws(() => calculateDough(leanDough(), {}), BatchError);
    assert.throws(() => calculateDough(leanDough(), { total: dec(1000), flour: dec(600) }), BatchError);
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
    assert.deepEqual(grams(preferment, 1), { 'Bread flour': '300.0', Water: '300.0', 'Fresh yeast': '0.9' });
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
    // source: professional bread-baking text, "Yeast conversions: fresh to dry" (D-9): instant = 0.33 × fresh
    const result = calculateDough(poolishDough(), { flour: dec(1000), yeast: 'instant' });
    const [preferment, final, overall] = result.groups;
    const yeast = (group: LineGroup) => group.lines.find((line) => line.name === 'Instant yeast');
    assert.equal(yeast(preferment)?.grams.toString(), '0.297');
    assert.equal(yeast(preferment)?.percent?.toString(), '0.099');
    assert.equal(yeast(final)?.grams.toString(), '4.653');
    assert.equal(yeast(overall)?.grams.toString(), '4.95');
    assert.match(yeast(final)?.note ?? '', /converted from 14\.1 g fresh yeast/);
    assert.equal(final.lines.find((line) => line.role === 'preferment')?.grams.toString(), '600.297');
    assert.equal(groupTotal(final).toString(), groupTotal(overall).toString());
    assert.ok(result.warnings.some((warning) => /changes the mixed dough by -10\.1 g/.test(warning)));
    assert.deepEqual(
      result.inputs.filter((f) => f.label === 'Yeast').map((f) => f.value),
      ['instant yeast'],
    );
  });

  it('should convert with the common set when asked to', () => {
    // common practice, no source (D-10): active dry = 0.5 × fresh
    const result = calculateDough(leanDough(), { flour: dec(1000), yeast: 'active-dry' }, { yeastFactors: COMMON_YEAST_FACTORS });
    assert.equal(result.groups[0].lines.find((line) => line.name === 'Active dry yeast')?.grams.toString(), '5');
  });

  it('should refuse a preferment that needs more than the overall formula holds', () => {
    assert.throws(
      () => calculateDough(poolishDough({ ...POOLISH, flour_pct: 80 }), { flour: dec(1000) }),
      /more Water than the whole batch has/,
    );
  });
});

describe('dough temperature in a batch', () => {
  const fahrenheitBatch = {
    flour: dec(1000),
    room: parseTemperature('65 °F'),
    flourTemp: parseTemperature('65 °F'),
  };

  it('should work out 30.556 °C water from a formula DDT of 75 °F and friction of 8 °F', () => {
    // source: San Francisco Baking Institute, Artisan I workshop reference material (2009) (WE-19, D-8)
    const result = calculateDough(leanDough({ ddt: { target: '75 °F', friction: '8 °F' } }), fahrenheitBatch);
    const water = figure(result, 'Water temperature');
    assert.equal(water?.kind, 'temperature');
    assert.equal(water?.value.toString().slice(0, 6), '30.555');
    assert.equal((water?.value as ReturnType<typeof dec>).toFixed(3), '30.556');
    assert.notEqual((water?.value as ReturnType<typeof dec>).toFixed(1), '27.0');
    assert.deepEqual(
      result.inputs.filter((f) => f.kind === 'temperature' || f.kind === 'temperature-difference').map((f) => f.label),
      ['Desired dough temperature', 'Room temperature', 'Flour temperature', 'Friction factor'],
    );
  });

  it('should count the preferment temperature with a preferment and need 70 °F water', () => {
    // own example, derived (WE-19): 4 × 76 − (72 + 70 + 68 + 24) = 70 °F
    const formula = { ...poolishDough(), ddt: { target: '76 °F', friction: '24 °F' } };
    const result = calculateDough(formula, {
      flour: dec(1000),
      room: parseTemperature('72 °F'),
      flourTemp: parseTemperature('70 °F'),
      prefermentTemp: parseTemperature('68 °F'),
    });
    const water = figure(result, 'Water temperature')?.value as ReturnType<typeof dec>;
    assert.equal(water.toFixed(6), parseTemperature('70 °F').toFixed(6));
  });

  it('should skip the water temperature and name the missing options', () => {
    const result = calculateDough(poolishDough(), { flour: dec(1000), ddt: dec(24), room: dec(22) });
    assert.equal(figure(result, 'Water temperature'), undefined);
    assert.ok(result.warnings.some((w) => /--flour-temp and --preferment-temp/.test(w)));
  });

  it('should count a missing friction factor as 0 and warn', () => {
    const result = calculateDough(leanDough(), { flour: dec(1000), ddt: dec(25), room: dec(22), flourTemp: dec(20) });
    assert.equal(figure(result, 'Water temperature')?.value.toString(), '33');
    assert.ok(result.warnings.some((w) => /friction factor/.test(w)));
  });

  it('should replace part of the water with ice when the tap is too warm', () => {
    // own example, derived from check-values D-12: water 3 × 24 − (26 + 26) − 14 = 6 °C,
    // tap 20 °C → ice = (20 − 6) / (20 + 79.7) of the water
    const result = calculateDough(leanDough(), {
      flour: dec(1000),
      ddt: dec(24),
      room: dec(26),
      flourTemp: dec(26),
      friction: parseTemperatureDifference('14 °C'),
      tap: dec(20),
    });
    assert.equal(figure(result, 'Water temperature')?.value.toString(), '6');
    const [dough] = result.groups;
    const tap = dough.lines.find((line) => line.name === 'Water at tap temperature');
    const ice = dough.lines.find((line) => line.role === 'ice');
    assert.ok(tap && ice);
    assert.equal(ice.name, 'Ice');
    assert.equal(ice.grams.toFixed(3), dec(670).times(14).div('99.7').toFixed(3));
    assert.equal(ice.grams.plus(tap.grams).toFixed(20), '670.00000000000000000000');
    assert.equal(groupTotal(dough).toFixed(6), '1700.000000');
    assert.equal(figure(result, 'Ice share of the water')?.value.toString().slice(0, 7), '14.0421');
  });

  it('should ice only the final dough water with a preferment', () => {
    const result = calculateDough(poolishDough(), {
      flour: dec(1000),
      ddt: dec(24),
      room: dec(26),
      flourTemp: dec(26),
      prefermentTemp: dec(22),
      friction: dec(14),
      tap: dec(20),
    });
    const [preferment, final] = result.groups;
    assert.ok(!preferment.lines.some((line) => line.role === 'ice'));
    assert.ok(final.lines.some((line) => line.role === 'ice'));
  });

  it('should warn, and still split, when the water must be below freezing', () => {
    // own example, derived: 3 × 20 − (30 + 30) − 5 = −5 °C; (20 + 5) / 99.7 of the water as ice
    const result = calculateDough(leanDough(), {
      flour: dec(1000), ddt: dec(20), room: dec(30), flourTemp: dec(30), friction: dec(5), tap: dec(20),
    });
    assert.ok(result.warnings.some((w) => /below freezing/.test(w)));
    assert.ok(result.groups[0].lines.some((line) => line.role === 'ice'));
  });

  it('should refuse to split the water when even all ice would not do', () => {
    // own example, derived: 3 × 10 − (40 + 40) − 10 = −60 °C; (20 + 60) / 99.7 ≈ 0.80 — still
    // possible; −90 °C gives (20 + 90) / 99.7 > 1
    const result = calculateDough(leanDough(), {
      flour: dec(1000), ddt: dec(10), room: dec(55), flourTemp: dec(55), friction: dec(10), tap: dec(20),
    });
    assert.equal(figure(result, 'Water temperature')?.value.toString(), '-90');
    assert.ok(result.warnings.some((w) => /Chill the flour/.test(w)));
    assert.ok(!result.groups[0].lines.some((line) => line.role === 'ice'));
  });
});
