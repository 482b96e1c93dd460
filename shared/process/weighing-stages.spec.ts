import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../decimal.ts';
import type { CureFormula, Formula } from '../formula/formula-types.ts';
import { actualYields, pumpReached, stagesFor } from './weighing-stages.ts';

const d = (text: string): Decimal => new Decimal(text);

/** A cure with the parts the stages look at. */
function cure(method: CureFormula['method'], yields?: CureFormula['yields']): Formula {
  return {
    formula: 1,
    id: 'test-belly',
    title: 'Test belly',
    kind: 'cure',
    method,
    product: 'bacon',
    species: 'pork',
    ingredients: [{ name: 'salt', pct: 2, salt: 100 }],
    ...(yields ? { yields } : {}),
  } as Formula;
}

describe('stage weights', () => {
  it('should offer a dry cure green, cured and the steps its yields give, never pumped', () => {
    assert.deepEqual(stagesFor(cure('dry', { smoke: 90, slice: 94 })), [
      'green',
      'cured',
      'smoked',
      'sliced',
    ]);
  });

  it('should offer a pump cure its pumped weight', () => {
    assert.deepEqual(stagesFor(cure('pump', { cure: 108 })), ['green', 'pumped', 'cured']);
  });

  it('should give each stage over the stage before it, beside the yields of the steps between', () => {
    const stages = new Map([
      ['green', d('5000')],
      ['pumped', d('5500')],
      ['cured', d('5350')],
      ['sliced', d('4300')],
    ] as const);
    const yields = actualYields(cure('pump', { cure: 108, smoke: 86, slice: 94 }), {
      stages,
      calculatedGrams: d('4800'),
      pumpTargetPct: d('10'),
    });
    assert.deepEqual(
      yields.map((y) => [y.stage, y.from, y.percent, y.planned]),
      [
        // source: yield = weight after ÷ weight before × 100, USDA ARS, USDA Table of Cooking
        // Yields for Meat and Poultry (2012/2014); own figures: 5500 ÷ 5000 = 110 %, against
        // 100 % + the 10 % pump target
        ['pumped', 'green', '110', '110'],
        // cured over green, as the formula's cure yield is: 5350 ÷ 5000 = 107 %, against 108 %
        ['cured', 'green', '107', '108'],
        // sliced over cured, smoked not weighed: 4300 ÷ 5350, against 86 % × 94 % = 80.84 %
        ['sliced', 'cured', d('4300').div('5350').times(100).toString(), '80.84'],
      ],
    );
  });

  it('should measure the first stage against the batch as calculated when green was not weighed', () => {
    const [smoked] = actualYields(cure('dry', { smoke: 90 }), {
      stages: new Map([['smoked', d('3800')]]),
      calculatedGrams: d('4000'),
    });
    // source: the USDA yield definition above; own figures, 3800 ÷ 4000 = 95 % against 90 %
    assert.deepEqual([smoked.from, smoked.percent, smoked.planned], [null, '95', '90']);
  });

  it('should find a pumped weight over its target only when it is over, unrounded', () => {
    // (pumped − green) ÷ green × 100, from memory (the standard trade definition): 5560 g on 5000 g
    // is 11.2 %, over a 10 % target of 5500 g; 5500 g is exactly on it
    const over = pumpReached(d('5000'), d('5560'), d('10'));
    assert.deepEqual(
      [over.percent.toString(), over.targetGrams.toString(), over.over],
      ['11.2', '5500', true],
    );
    assert.equal(pumpReached(d('5000'), d('5500'), d('10')).over, false);
    assert.equal(pumpReached(d('5000'), d('5500.001'), d('10')).over, true);
  });
});
