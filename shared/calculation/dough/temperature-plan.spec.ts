import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { dec } from '../../decimal.ts';
import { parseTemperature, parseTemperatureDifference } from '../../units/temperature.ts';
import { calculateDough } from './calculate-dough.ts';
import {
  figure,
  figureValue as value,
  bunDough,
  groupTotal,
  doughFormula,
  leanDough,
  poolishDough,
} from './dough-fixtures.ts';

describe('dough temperature in a batch', () => {
  const fahrenheitBatch = {
    flour: dec(1000),
    room: parseTemperature('65 °F'),
    flourTemp: parseTemperature('65 °F'),
  };

  it('should work out 30.556 °C water from a formula DDT of 75 °F and friction of 8 °F', () => {
    // source: San Francisco Baking Institute, Artisan I workshop reference material (2009); in °C
    // the friction factor, a difference, takes only the 5/9 factor (derived)
    const result = calculateDough(
      leanDough({ ddt: { target: '75 °F', friction: '8 °F' } }),
      fahrenheitBatch,
    );
    const water = figure(result, 'Water temperature');
    assert.equal(water?.kind, 'temperature');
    assert.equal(value(result, 'Water temperature').toFixed(3), '30.556');
    assert.notEqual(value(result, 'Water temperature').toFixed(1), '27.0');
    assert.deepEqual(
      result.inputs
        .filter((f) => f.kind === 'temperature' || f.kind === 'temperature-difference')
        .map((f) => f.label),
      ['Desired dough temperature', 'Room temperature', 'Flour temperature', 'Friction factor'],
    );
  });

  it('should count the preferment temperature with a preferment and need 70 °F water', () => {
    // own example, derived (the San Francisco Baking Institute rule with a preferment):
    // 4 × 76 − (72 + 70 + 68 + 24) = 70 °F
    const formula = { ...poolishDough(), ddt: { target: '76 °F', friction: '24 °F' } };
    const result = calculateDough(formula, {
      flour: dec(1000),
      room: parseTemperature('72 °F'),
      flourTemp: parseTemperature('70 °F'),
      prefermentTemp: parseTemperature('68 °F'),
    });
    assert.equal(
      value(result, 'Water temperature').toFixed(6),
      parseTemperature('70 °F').toFixed(6),
    );
  });

  it('should skip the water temperature and name the missing options', () => {
    const result = calculateDough(poolishDough(), {
      flour: dec(1000),
      ddt: dec(24),
      room: dec(22),
    });
    assert.equal(figure(result, 'Water temperature'), undefined);
    assert.ok(result.warnings.some((w) => /--flour-temp and --preferment-temp/.test(w)));
  });

  it('should count a missing friction factor as 0 and warn', () => {
    const result = calculateDough(leanDough(), {
      flour: dec(1000),
      ddt: dec(25),
      room: dec(22),
      flourTemp: dec(20),
    });
    assert.equal(figure(result, 'Water temperature')?.value.toString(), '33');
    assert.ok(result.warnings.some((w) => /friction factor/.test(w)));
  });

  it('should replace part of the water with ice when the tap is too warm', () => {
    // own example, derived from the ice heat balance (see `iceFraction`): water
    // 3 × 24 − (26 + 26) − 14 = 6 °C, tap 20 °C → ice = (20 − 6) / (20 + 79.7) of the
    // water
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
    // 14 / 99.7 = 14.042 %
    assert.equal(value(result, 'Ice share of the water').toFixed(3), '14.042');
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
      flour: dec(1000),
      ddt: dec(20),
      room: dec(30),
      flourTemp: dec(30),
      friction: dec(5),
      tap: dec(20),
    });
    assert.ok(result.warnings.some((w) => /below freezing/.test(w)));
    assert.ok(result.groups[0].lines.some((line) => line.role === 'ice'));
  });

  it('should refuse to split the water when even all ice would not do', () => {
    // own example, derived: 3 × 10 − (55 + 55) − 10 = −90 °C; (20 + 90) / 99.7 > 1
    const result = calculateDough(leanDough(), {
      flour: dec(1000),
      ddt: dec(10),
      room: dec(55),
      flourTemp: dec(55),
      friction: dec(10),
      tap: dec(20),
    });
    assert.equal(figure(result, 'Water temperature')?.value.toString(), '-90');
    assert.ok(result.warnings.some((w) => /Chill the flour/.test(w)));
    assert.ok(!result.groups[0].lines.some((line) => line.role === 'ice'));
  });
});

describe('every liquid tempered, ice only from the water', () => {
  // The rule's "water" is the liquid that goes in: milk and egg count as it does.
  // source: San Francisco Baking Institute, Artisan I workshop reference material (2009);
  // text read: "Dough Temperature", starreveld.com/Baking/Dough_Temperature.html ("water/liquids
  // used … (milk, or other liquids)"). Bun: own example formula, 1000 g flour → water 50 g,
  // milk 500 g, egg 100 g.
  const warmKitchen = { flour: dec(1000), ddt: dec(24), flourTemp: dec(26), friction: dec(14) };

  it('should bring the milk and egg to the liquid temperature and ice only the water', () => {
    // own example, derived (the San Francisco Baking Institute rule and the ice heat balance):
    // 3 × 24 − (26 + 26) − 14 = 6 °C; ice = 50 × 14 / 99.7 g
    const result = calculateDough(bunDough(), { ...warmKitchen, room: dec(26), tap: dec(20) });
    assert.equal(value(result, 'Liquid temperature').toString(), '6');
    assert.equal(value(result, 'Bring Whole milk and Whole egg to').toString(), '6');
    assert.equal(value(result, 'Water temperature').toString(), '6');
    const lines = result.groups[0].lines;
    const ice = lines.find((line) => line.role === 'ice');
    assert.equal(ice?.grams.toFixed(6), dec(50).times(14).div('99.7').toFixed(6));
    assert.equal(lines.find((line) => line.name === 'Whole milk')?.grams.toString(), '500');
    assert.deepEqual(result.warnings, []);
  });

  it('should temper a dough with milk and no water without asking for ice', () => {
    // own example, derived: the milk goes in at 6 °C; there is no water to ice and none needed
    const milkOnly = doughFormula([
      { name: 'Flour', pct: 100, flour: true },
      { name: 'Milk', pct: 65, food: 'milk-whole' },
      { name: 'Salt', pct: 2 },
    ]);
    const result = calculateDough(milkOnly, { ...warmKitchen, room: dec(26), tap: dec(20) });
    assert.equal(value(result, 'Bring Milk to').toString(), '6');
    assert.equal(figure(result, 'Water temperature'), undefined);
    assert.deepEqual(result.warnings, []);
  });

  it('should make the water colder to make up for milk and egg that cannot go below freezing', () => {
    // own example, derived from the ice heat balance: 3 × 24 − (34 + 26) − 14 = −2 °C;
    // milk and egg at 0 °C; ice = (water × tap + others × 0 − all liquid × liquid T) ÷ (tap + 79.7)
    // = (50 × 20 + 650 × 2) ÷ 99.7 = 23.069 g of the 50 g of water
    const result = calculateDough(bunDough(), { ...warmKitchen, room: dec(34), tap: dec(20) });
    assert.equal(value(result, 'Liquid temperature').toString(), '-2');
    assert.equal(value(result, 'Bring Whole milk and Whole egg to').toString(), '0');
    // (650 × −2 − 600 × 0) ÷ 50 = −26 °C
    assert.equal(value(result, 'Water temperature').toString(), '-26');
    const ice = result.groups[0].lines.find((line) => line.role === 'ice');
    assert.equal(ice?.grams.toFixed(3), '23.069');
  });

  it('should say plainly when the water alone cannot bring the dough to its temperature', () => {
    // own example, derived: 3 × 24 − (42 + 26) − 14 = −10 °C; milk and egg at 0 °C; ice needed
    // (50 × 20 + 650 × 10) ÷ 99.7 = 75.226 g for 50 g of water: not possible
    const result = calculateDough(bunDough(), { ...warmKitchen, room: dec(42), tap: dec(20) });
    assert.ok(!result.groups[0].lines.some((line) => line.role === 'ice'));
    const warning = result.warnings.find((w) => /water alone cannot/.test(w));
    assert.ok(warning, result.warnings.join('\n'));
    assert.match(warning, /75\.2 g of ice/);
    assert.match(warning, /50\.0 g of water/);
    assert.match(warning, /[Cc]hill/);
  });
});
