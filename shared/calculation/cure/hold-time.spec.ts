import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../../decimal.ts';
import type { CureFormula } from '../../formula/formula-types.ts';
import { GRAMS_PER_POUND } from '../../units/mass.ts';
import { estimateHold } from './hold-time.ts';

const d = (value: string | number): Decimal => new Decimal(value);
const pounds = (lb: string) => d(lb).times(GRAMS_PER_POUND);

const CURING_SALT = { name: 'curing salt', pct: 0.1, nitrite: 6.25, salt: 93.75 };

/** A whole-muscle brine cure with no hold rule: water % of the meat, salt % of meat + water. */
function brine(waterPct: number, saltPct: number): CureFormula {
  const ingredients = [{ name: 'salt', pct: saltPct, salt: 100 }, CURING_SALT];
  const identity = { formula: 1, id: 'test-brine', title: 'Test brine' } as const;
  return {
    ...identity,
    kind: 'cure',
    method: 'brine',
    product: 'whole-muscle',
    ingredients,
    brine: { water_pct: waterPct },
  };
}

// A strong pickle, own example: 8 lb of salt to 37.5 lb of water for 100 lb of meat → salt 5.82 %
// of meat + water (8 ÷ 137.5); 1.375 × (5.82 + 0.09375) = 8.1314 lb of salt in 37.5 lb of water
// = 17.82 % = 67.5 °SAL (°SAL = % salt ÷ 26.395 × 100, "The Salometer and How to Use It").
const SWEET_PICKLE = brine(37.5, 5.82);
// An equilibrium brine: water 50 % of the meat, salt 2.3 % of meat + water → 1.5 × (2.3 +
// 0.09375) = 3.5906 % of green weight in 50 % water = 6.701 % = 25.4 °SAL.
const EQUILIBRIUM = brine(50, 2.3);

describe('the hold of a brine cure with no rule of its own', () => {
  it('takes 4 days per pound only for a pickle as strong as a sweet pickle', () => {
    // source: USDA, Pork: Slaughtering, Cutting, Preserving, and Cooking on the Farm (Farmers'
    // Bulletin, 1978 revision), "Sweet Pickle Cure": 3½–4 days per pound; a 6 lb shoulder
    // 24 days, a 15 lb ham 60
    const days = (lb: string) => {
      const hold = estimateHold(SWEET_PICKLE, { largestPieceGrams: pounds(lb) });
      assert.ok('days' in hold, JSON.stringify(hold));
      assert.match(hold.source, /sweet pickle/);
      return hold.days;
    };
    assert.equal(days('6'), 24);
    assert.equal(days('15'), 60);
  });

  it('does not give a weak equilibrium brine the sweet pickle’s days per pound', () => {
    // The example: a 2.5 kg piece under a 25 °SAL brine got 4 × 5.51 lb = 23 days.
    // The sweet-pickle rule is for a strong pickle (threshold: common practice, no source).
    const hold = estimateHold(EQUILIBRIUM, { largestPieceGrams: d(2500) });
    assert.ok('missing' in hold, JSON.stringify(hold));
    assert.match(hold.missing, /weaker than a sweet pickle/);
    assert.match(hold.missing, /--thickness/);
  });

  it('goes by thickness for a weak brine, marked as a rule of thumb', () => {
    // common practice, no source: about 1½ days per cm of thickness; 5 cm → 7.5 → 8 days
    const hold = estimateHold(EQUILIBRIUM, { thicknessMm: d(50), largestPieceGrams: d(2500) });
    assert.ok('days' in hold, JSON.stringify(hold));
    assert.equal(hold.days, 8);
    assert.match(hold.source, /rule of thumb/);
    assert.match(hold.source, /common practice, no source/);
  });

  it('judges the brine actually made when the batch gives its own water', () => {
    // The strong pickle's make-up with 150 lb of water to 100 lb of meat (given by the batch):
    // salt = 2.5 × 5.91375 = 14.784 lb in 150 lb of water = 8.97 % = 34.0 °SAL, a weak brine.
    const strength = d('14.784375').div(d('164.784375')).times(100);
    const hold = estimateHold(SWEET_PICKLE, {
      largestPieceGrams: pounds('6'),
      brineStrength: strength,
    });
    assert.ok('missing' in hold, JSON.stringify(hold));
  });
});
