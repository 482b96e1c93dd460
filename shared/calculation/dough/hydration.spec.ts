import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { dec } from '../../decimal.ts';
import type { DoughIngredient } from '../../formula/formula-types.ts';
import { WATER_CONTENT, waterContentPct } from '../../reference/water-content.ts';
import { bunDough } from './dough-fixtures.ts';
import { lineAtPercent } from './dough-line.ts';
import { effectiveHydration, plainWaterHydration, waterContentOfLine } from './hydration.ts';
import { convertYeastLine } from './yeast.ts';

const lines = (ingredients: DoughIngredient[]) =>
  ingredients.map((ingredient) => lineAtPercent(ingredient, dec(ingredient.pct), dec(1000)));

describe('water content of ingredients', () => {
  it('should carry the USDA SR Legacy water contents by NDB number', () => {
    // source: USDA National Nutrient Database for Standard Reference, Release 26, field Water_(g)
    const expected: [keyof typeof WATER_CONTENT, string, string][] = [
      ['milk-whole', '01077', '88.13'],
      ['milk-2pct', '01079', '89.21'],
      ['milk-skim', '01085', '90.84'],
      ['buttermilk', '01088', '90.13'],
      ['cream-heavy', '01053', '57.71'],
      ['sour-cream', '01056', '74.46'],
      ['yogurt-whole', '01116', '87.9'],
      ['butter-salted', '01001', '15.87'],
      ['butter-unsalted', '01145', '17.94'],
      ['egg-whole', '01123', '76.15'],
      ['egg-white', '01124', '87.57'],
      ['egg-yolk', '01125', '52.31'],
      ['honey', '19296', '17.1'],
      ['molasses', '19304', '21.87'],
      ['maple-syrup', '19353', '32.39'],
      ['corn-syrup', '19350', '22.81'],
      ['yeast-fresh', '18374', '69'],
    ];
    for (const [key, ndb, water] of expected) {
      assert.equal(WATER_CONTENT[key].ndb, ndb, key);
      assert.equal(waterContentPct(key).toString(), water, key);
    }
  });

  it('should count plain water as all water, by definition', () => {
    assert.equal(waterContentPct('water').toString(), '100');
    assert.equal(WATER_CONTENT.water.ndb, undefined);
  });
});

describe('hydration', () => {
  it('should count 59.122 % effective hydration in the enriched bun dough', () => {
    // source: USDA National Nutrient Database for Standard Reference, Release 26, field Water_(g);
    // own example, derived: (50×0.8813 + 10×0.7615 + 10×0.1587 + 5×0.171 + 5×1) / 100
    const hydration = effectiveHydration(lines(bunDough().ingredients));
    assert.equal(hydration.toString(), '59.122');
  });

  it('should count 5 % hydration from plain water in the enriched bun dough', () => {
    assert.equal(plainWaterHydration(lines(bunDough().ingredients)).toString(), '5');
  });

  it('should let water_pct win over the published figure', () => {
    const [line] = lines([{ name: 'Milk', pct: 50, food: 'milk-whole', water_pct: 90 }]);
    assert.equal(waterContentOfLine(line)?.toString(), '90');
    assert.equal(effectiveHydration([line]).toString(), '45');
  });

  it('should not count ingredients that declare no water content', () => {
    const [line] = lines([{ name: 'Olive oil', pct: 5 }]);
    assert.equal(waterContentOfLine(line), undefined);
    assert.equal(effectiveHydration([line]).toString(), '0');
  });

  it('should stop counting fresh-yeast water once the yeast is converted to a dry kind', () => {
    const [fresh] = lines([{ name: 'Yeast', pct: 2, yeast: 'fresh', food: 'yeast-fresh' }]);
    assert.equal(effectiveHydration([fresh]).toString(), '1.38');
    assert.equal(effectiveHydration([convertYeastLine(fresh, 'instant')]).toString(), '0');
  });
});
