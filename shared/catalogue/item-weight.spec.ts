import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { QuantityError } from '../units/quantity-error.ts';
import { itemWeightOf, parseItemWeight } from './item-weight.ts';

describe('parseItemWeight', () => {
  it('should read the weight of one piece of an item stocked by count', () => {
    const egg = parseItemWeight('50 g', 'each');
    assert.equal(egg.grams.toString(), '50');
    assert.equal(egg.per.toString(), '1');
    assert.equal(parseItemWeight('50 g each', 'each').grams.toString(), '50');
    // 2 oz = 2 × 453.59237 ÷ 16 g. source: NIST SP 811 (2008), Appendix B.8
    assert.equal(parseItemWeight('2 oz', 'each').grams.toString(), '56.69904625');
  });

  it('should read a weight per volume of an item stocked by volume, a cup being a US cup', () => {
    const milk = parseItemWeight('244 g per cup', 'l');
    assert.equal(milk.grams.toString(), '244');
    // A US cup is a sixteenth of 3.785411784 L: 236.5882365 ml.
    // source: NIST SP 811 (2008), Appendix B.8, gallon (U.S.) = 3.785 411 784 L, exact
    assert.equal(milk.per.toString(), '236.5882365');
    assert.equal(parseItemWeight('488 g per 2 cups', 'ml').per.toString(), '473.176473');
    const litre = parseItemWeight('1.03 kg per l', 'l');
    assert.deepEqual([litre.grams.toString(), litre.per.toString()], ['1030', '1000']);
    assert.equal(parseItemWeight('30 g PER 25 ml', 'ml').per.toString(), '25');
  });

  it('should refuse a weight per unit that does not fit the item, in words', () => {
    const refusal = (text: string, unit: 'kg' | 'each' | 'l') => {
      try {
        parseItemWeight(text, unit);
      } catch (error) {
        assert.ok(error instanceof QuantityError);
        return error.reason;
      }
      assert.fail(`${text} for ${unit} was read`);
    };
    assert.match(refusal('50 g', 'kg'), /stocked by weight \(kg\): leave weighs out/);
    assert.match(refusal('244 g per cup', 'each'), /stocked by count: give one’s weight/);
    assert.match(refusal('244 g', 'l'), /stocked by volume: say per how much/);
    assert.match(refusal('0 g', 'each'), /more than nothing/);
    assert.match(refusal('244 g per 0 ml', 'l'), /more than nothing/);
    assert.match(refusal('1 g per l per l', 'l'), /"per" is given twice/);
    assert.match(refusal('fifty grams', 'each'), /.+/);
  });

  it('should give no weight for an item without one, or with one that does not read', () => {
    assert.equal(itemWeightOf({ unit: 'each' }), undefined);
    assert.equal(itemWeightOf({ unit: 'each', weighs: 'a handful' }), undefined);
    assert.equal(itemWeightOf({ unit: 'each', weighs: '50 g' })?.grams.toString(), '50');
  });
});
