import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../../decimal.ts';
import type { CureFormula } from '../../formula/formula-types.ts';
import { holdSizeOf, holdSizeOfRule } from './hold-size.ts';

const CURING_SALT = { name: 'curing salt', pct: 0.25, nitrite: 6.25, salt: 93.75 };
const IDENTITY = { formula: 1, id: 'test-cure', title: 'Test cure', kind: 'cure' } as const;

function cure(method: CureFormula['method'], hold?: CureFormula['hold']): CureFormula {
  return {
    ...IDENTITY,
    method,
    product: method === 'dry' ? 'bacon' : 'whole-muscle',
    ingredients: [{ name: 'salt', pct: 2.5, salt: 100 }, CURING_SALT],
    ...(method === 'brine' ? { brine: { water_pct: 50 } } : {}),
    ...(hold ? { hold } : {}),
  };
}

describe('the size a hold is reckoned on', () => {
  it('is the thickness for days per cm or inch, the heaviest piece for days per kg or pound', () => {
    assert.equal(holdSizeOfRule({ days_per_cm: 2, min_days: 7 }), 'thickness');
    assert.equal(holdSizeOfRule({ days_per_inch: 7 }), 'thickness');
    assert.equal(holdSizeOfRule({ days_per_kg: 1, plus_days: 1 }), 'largestPiece');
    assert.equal(holdSizeOfRule({ days_per_lb: 4 }), 'largestPiece');
  });

  it('is none for fixed days, even with a minimum beside a rate elsewhere', () => {
    assert.equal(holdSizeOfRule({ days: 2 }), null);
    assert.equal(holdSizeOf(cure('dry', { days: 1 })), null);
  });

  it('follows the default rule of a cure with none of its own', () => {
    // A dry cure's default is about 7 days per inch (common practice, no source).
    assert.equal(holdSizeOf(cure('dry')), 'thickness');
    // An injected cure has no default hold to reckon.
    assert.equal(holdSizeOf(cure('pump')), null);
    // A brine as strong as a sweet pickle goes by the pound of the piece. source: USDA, Pork:
    // Slaughtering, Cutting, Preserving, and Cooking on the Farm, "Sweet Pickle Cure"; 17.8 %
    // salt is 67.5 °SAL ("The Salometer and How to Use It": % salt ÷ 26.395 × 100).
    assert.equal(holdSizeOf(cure('brine'), new Decimal('17.8')), 'largestPiece');
    // A weaker, equilibrium brine goes by thickness (common practice, no source).
    assert.equal(holdSizeOf(cure('brine'), new Decimal('6.7')), 'thickness');
  });
});
