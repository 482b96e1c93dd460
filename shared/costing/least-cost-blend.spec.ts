import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { pearsonSquare } from '../calculation/blend/pearson-square.ts';
import { dec } from '../decimal.ts';
import { type LeastCostBlend, type TrimOnHand, leastCostBlend } from './least-cost-blend.ts';

/** A trim from plain figures: fat %, price per kg, kilograms on hand. */
function trim(name: string, fat: string, price: string, kg: string, fatAsSuch = false): TrimOnHand {
  return {
    name,
    fatPercent: dec(fat),
    pricePerKg: dec(price),
    availableGrams: dec(kg).times(1000),
    ...(fatAsSuch ? { fatAsSuch } : {}),
  };
}

/** The blend as "name: grams" lines. */
function shares(blend: LeastCostBlend): string[] {
  assert.ok(blend.ok, blend.ok ? '' : blend.message);
  return blend.shares.map((share) => `${share.trim.name}: ${share.grams.toString()}`);
}

// Invented trims and prices of the Quillmoor Smokehouse.
const LEAN = trim('90/10 lean', '10', '6.00', '60');
const CHUCK = trim('80/20 chuck', '20', '4.50', '50');
const FAT_TRIM = trim('50/50 trim', '50', '2.00', '40');

describe('leastCostBlend, a hand-solved case', () => {
  // Hand working, 100 kg at 25 % fat (2 500 kg·% of fat) from the three trims above.
  // The 50/50 is cheapest and the lean dearest, so try each pair of trims with the third at a
  // bound (none, or all on hand):
  //  - lean + 50/50, chuck none: lean = 100 × (50 − 25) ÷ 40 = 62.5 kg > 60 on hand: no.
  //  - lean + 50/50, chuck all 50 kg: 50 kg left to make at (2 500 − 1 000) ÷ 50 = 30 %:
  //    lean = 50 × (50 − 30) ÷ 40 = 25 kg, 50/50 = 25 kg; cost 25 × 6 + 50 × 4.5 + 25 × 2 = 425.
  //  - chuck + 50/50, lean all 60 kg: 40 kg at (2 500 − 600) ÷ 40 = 47.5 %: chuck 3.333 kg,
  //    50/50 36.667 kg; cost 360 + 15 + 73.33 = 448.33.
  //  - chuck + 50/50, lean none: chuck = 100 × 25 ÷ 30 = 83.3 kg > 50 on hand: no.
  //  - lean + chuck: both at most 20 % fat, and with all the 50/50 the rest would need 8.3 %: no.
  // Cheapest: lean 25 kg, chuck 50 kg, 50/50 25 kg, 425.00, 4.25 a kg; fat 2.5 + 10 + 12.5 =
  // 25 kg in 100 kg = 25 %. (derived: the mass and fat balances of a linear blend)
  it('should find 25 kg lean, 50 kg chuck and 25 kg of 50/50 at 4.25 a kilogram', () => {
    const blend = leastCostBlend({
      trims: [LEAN, CHUCK, FAT_TRIM],
      targetFatPercent: dec('25'),
      batchGrams: dec('100000'),
      standard: 'ground-beef',
    });
    assert.deepEqual(shares(blend), [
      '90/10 lean: 25000',
      '80/20 chuck: 50000',
      '50/50 trim: 25000',
    ]);
    assert.ok(blend.ok && blend.cost.equals(dec('425')));
    assert.ok(blend.ok && blend.costPerKg.equals(dec('4.25')));
  });

  // derived: the same trims in another order are the same problem
  it('should give the same blend whichever order the trims come in', () => {
    const blend = leastCostBlend({
      trims: [FAT_TRIM, LEAN, CHUCK],
      targetFatPercent: dec('25'),
      batchGrams: dec('100000'),
    });
    assert.deepEqual(shares(blend), [
      '50/50 trim: 25000',
      '90/10 lean: 25000',
      '80/20 chuck: 50000',
    ]);
  });
});

describe('leastCostBlend against the Pearson square', () => {
  // source: the Pearson square, "Meat Calculations" training presentation for meat-evaluation
  // contests (issuer not identified), https://slideplayer.com./slide/7660647: own example, 10 %
  // and 50 % trim to 100 kg at 20 % fat: parts 30 and 10, so 75 kg and 25 kg. With two trims
  // and plenty of both there is only one mix, whatever they cost.
  it('should split two trims as the Pearson square does, at any price', () => {
    const square = pearsonSquare(dec('10'), dec('50'), dec('20'), dec('100000'));
    for (const [leanPrice, fatPrice] of [
      ['6.00', '2.00'],
      ['2.00', '6.00'],
      ['3.00', '3.00'],
    ]) {
      const blend = leastCostBlend({
        trims: [trim('lean', '10', leanPrice, '200'), trim('fat', '50', fatPrice, '200')],
        targetFatPercent: dec('20'),
        batchGrams: dec('100000'),
      });
      assert.deepEqual(shares(blend), [`lean: ${square.first}`, `fat: ${square.second}`]);
      assert.deepEqual(shares(blend), ['lean: 75000', 'fat: 25000']);
    }
  });
});

describe('leastCostBlend refusals', () => {
  const ask = { trims: [LEAN, CHUCK, FAT_TRIM], batchGrams: dec('100000') };

  // source: 9 CFR 319.15(a), ground beef at most 30 % fat (FAT_STANDARDS, as quoted there)
  it('should refuse a target above the standard of identity', () => {
    const blend = leastCostBlend({ ...ask, targetFatPercent: dec('32'), standard: 'ground-beef' });
    assert.ok(!blend.ok && blend.refusal === 'above-standard');
    assert.equal(
      !blend.ok && blend.message,
      '32 % fat is above the 30 % that ground beef may have (9 CFR 319.15(a)).',
    );
  });

  // derived: 60 + 50 + 40 = 150 kg on hand
  it('should refuse a batch heavier than the trims on hand', () => {
    const blend = leastCostBlend({
      ...ask,
      targetFatPercent: dec('25'),
      batchGrams: dec('150001'),
    });
    assert.ok(!blend.ok && blend.refusal === 'not-enough-stock');
    assert.equal(
      !blend.ok && blend.message,
      'The trims on hand weigh 150 kg; the batch needs 150.001 kg.',
    );
  });

  // derived: a blend's fat lies between its leanest and its fattest trim
  it('should refuse a target outside the trims’ fats', () => {
    const blend = leastCostBlend({ ...ask, targetFatPercent: dec('5') });
    assert.ok(!blend.ok && blend.refusal === 'fat-out-of-range');
    assert.equal(
      !blend.ok && blend.message,
      'No mix of the trims on hand has 5 % fat: they run from 10 % to 50 %.',
    );
  });

  // hand-worked: 10 kg of 50/50 brings 10 × (50 − 25) = 250 kg·% of fat over 25 %; each kg of
  // lean takes up 25 − 10 = 15, so 16.667 kg of lean: at most 26.667 kg at 25 % (printed down to
  // 26.666 kg, never more than can be made)
  it('should refuse a weight the trims cannot reach at the target fat, saying the most they can', () => {
    const blend = leastCostBlend({
      trims: [trim('lean', '10', '6', '100'), trim('50/50', '50', '2', '10')],
      targetFatPercent: dec('25'),
      batchGrams: dec('100000'),
    });
    assert.ok(!blend.ok && blend.refusal === 'not-enough-at-target');
    assert.equal(
      !blend.ok && blend.message,
      'The trims on hand make at most 26.666 kg at 25 % fat; the batch needs 100 kg.',
    );
  });

  it('should refuse a batch of nothing and a trim with an impossible fat', () => {
    assert.throws(
      () => leastCostBlend({ ...ask, targetFatPercent: dec('20'), batchGrams: dec('0') }),
      RangeError,
    );
    assert.throws(
      () =>
        leastCostBlend({
          ...ask,
          trims: [trim('odd', '101', '1', '1')],
          targetFatPercent: dec('20'),
        }),
      RangeError,
    );
  });
});

describe('leastCostBlend and fat added as such', () => {
  // source: 9 CFR 319.15(a) takes no beef fat added as such in ground beef; 319.15(b) allows it in
  // hamburger (FAT_STANDARDS, wording as quoted there). Hand-worked, 100 kg at 20 % fat, plenty
  // of each; suet and 50/50 are both fatter than 20 %, so the only vertices pair each with lean:
  //  - lean + suet: lean = 100 × (90 − 20) ÷ 80 = 87.5 kg, suet 12.5 kg; 525 + 12.5 = 537.50.
  //  - lean + 50/50: lean = 100 × (50 − 20) ÷ 40 = 75 kg, 50/50 25 kg; 450 + 100 = 550.00.
  // Hamburger takes the suet (537.50); ground beef may not, so the 50/50 (550.00).
  it('should leave suet out of ground beef and use it in hamburger when it is cheaper', () => {
    const trims = [
      trim('90/10 lean', '10', '6', '200'),
      trim('suet', '90', '1', '50', true),
      trim('50/50 trim', '50', '4', '200'),
    ];
    const ground = leastCostBlend({
      trims,
      targetFatPercent: dec('20'),
      batchGrams: dec('100000'),
      standard: 'ground-beef',
    });
    assert.deepEqual(shares(ground), ['90/10 lean: 75000', '50/50 trim: 25000']);
    assert.ok(ground.ok && ground.cost.equals(dec('550')));
    assert.deepEqual(ground.ok && ground.leftOut.map((t) => t.name), ['suet']);
    const hamburger = leastCostBlend({
      trims,
      targetFatPercent: dec('20'),
      batchGrams: dec('100000'),
      standard: 'hamburger',
    });
    assert.deepEqual(shares(hamburger), ['90/10 lean: 87500', 'suet: 12500']);
    assert.ok(hamburger.ok && hamburger.cost.equals(dec('537.5')));
  });
});
