import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { dec } from '../../decimal.ts';
import { BEFORE_TRIM } from '../yields.ts';
import { calculateBlend } from './calculate-blend.ts';
import { figure, grams, we25 } from './blend-spec-helpers.ts';

describe('calculateBlend, sizes', () => {
  it('should blend 100 kg at 20 % fat from 75 kg of 10 % and 25 kg of 50 % trim', () => {
    // own worked example of the Pearson square ("Meat Calculations" training presentation for
    // meat-evaluation contests, issuer not identified): lean = 100 × 30/40 = 75.000 kg, 50/50 =
    // 25.000 kg;
    // check 7.5 + 12.5 = 20.0 kg fat = 20 %.
    const result = calculateBlend(we25(), { total: dec('100000') });
    const meat = result.groups[0];
    assert.equal(meat.title, 'Meat');
    assert.equal(meat.percentOf, 'blend weight');
    assert.deepEqual(
      meat.lines.map((l) => [l.name, l.role, l.grams.toString(), l.percent?.toString()]),
      [
        ['lean 90/10 trim (10 % fat)', 'component', '75000', '75'],
        ['50/50 trim (50 % fat)', 'component', '25000', '25'],
      ],
    );
    assert.ok(figure(result, 'Blend fat').equals(dec('20')));
    assert.ok(figure(result, 'Chemical lean').equals(dec('80')));
    assert.ok(figure(result, 'Total batch weight').equals(dec('100000')));
    assert.equal(result.groups.length, 1);
  });

  it('should add 4 kg of 50 % trim to 12 kg of 10 % trim on hand', () => {
    // own example, derived: 12 × (10 − 20) ÷ (20 − 50) = 4 kg of 50/50; total 16 kg;
    // 1.2 + 2.0 = 3.2 kg fat = 20 % of 16 kg.
    const result = calculateBlend(we25(), { onHand: [{ key: 'lean', grams: dec('12000') }] });
    assert.deepEqual(grams(result, 'Meat'), ['12000.000', '4000.000']);
    assert.ok(figure(result, 'Blend fat').equals(dec('20')));
    assert.ok(figure(result, 'Total batch weight').equals(dec('16000')));
    assert.equal(result.inputs[1].label, 'on hand: lean 90/10 trim');
  });

  it('should keep the formula order when the second component is on hand', () => {
    // own example, derived: 5 × (50 − 20) ÷ (20 − 10) = 15 kg of 10 % trim; total 20 kg.
    const result = calculateBlend(we25(), { onHand: [{ key: 'fat', grams: dec('5000') }] });
    assert.deepEqual(grams(result, 'Meat'), ['15000.000', '5000.000']);
  });

  it('should read chemical lean as 100 minus fat (CL 90 is 10 % fat)', () => {
    // the same own Pearson example, with the lean trim given as CL 90 and the target as CL 80
    const formula = we25({
      components: [
        { key: 'lean', name: 'lean trim', lean: 90 },
        { key: 'fat', name: '50/50 trim', lean: 50 },
      ],
      target: { lean: 80 },
    });
    const result = calculateBlend(formula, { total: dec('100000') });
    assert.deepEqual(grams(result, 'Meat'), ['75000.000', '25000.000']);
    assert.equal(result.groups[0].lines[0].name, 'lean trim (10 % fat)');
    assert.ok(figure(result, 'Chemical lean').equals(dec('80')));
  });

  it('should use --target-fat instead of the formula target', () => {
    // own example, derived: 30 % from 10 % and 50 %: parts 20 and 20, half each of 10 kg.
    const result = calculateBlend(we25(), { total: dec('10000'), targetFat: dec('30') });
    assert.deepEqual(grams(result, 'Meat'), ['5000.000', '5000.000']);
    assert.equal(result.inputs[0].note, 'from --target-fat');
  });

  it('should work back from 50 kg cooked at a 72 % cook yield to 69.444 kg raw', () => {
    // own worked example, cooking yield = cooked ÷ raw (USDA ARS Table of Cooking Yields):
    // 50 / 0.72 = 69.444 kg, split as the own Pearson example: 75 % = 52.083 kg, 25 % =
    // 17.361 kg.
    const result = calculateBlend(we25({ yields: { cook: 72 } }), { want: dec('50000') });
    assert.equal(figure(result, 'Total batch weight').toFixed(3), '69444.444');
    assert.deepEqual(grams(result, 'Meat'), ['52083.333', '17361.111']);
    assert.equal(result.yields?.[0].step, 'cook');
    assert.equal(result.yields?.[0].grams.toFixed(3), '50000.000');
  });

  it('should take the finished weight as the raw weight when there are no yields', () => {
    const result = calculateBlend(we25(), { want: dec('8000') });
    assert.ok(figure(result, 'Total batch weight').equals(dec('8000')));
    assert.equal(result.yields, undefined);
  });

  it('should count seasoning into the cooked weight but not into the trim', () => {
    // own example, derived: 50 kg cooked at 72 % → 69.444444 kg raw batch; seasoning
    // 2 % of the meat → meat = 69.444444 / 1.02 = 68.082789 kg; buy 68.082789 / 0.80 =
    // 85.103486 kg before trim; seasoning 1.361656 kg; cooked (meat + seasoning) × 0.72 = 50 kg.
    const formula = we25({
      yields: { trim: 80, cook: 72 },
      ingredients: [
        { name: 'salt', pct: 1.5 },
        { name: 'black pepper', pct: 0.5 },
      ],
    });
    const result = calculateBlend(formula, { want: dec('50000') });
    assert.equal(
      result.groups[0].lines[0].grams.plus(result.groups[0].lines[1].grams).toFixed(3),
      '68082.789',
    );
    assert.deepEqual(
      result.yields?.map((s) => [s.step, s.grams.toFixed(3)]),
      [
        [BEFORE_TRIM, '85103.486'],
        ['cook', '50000.000'],
      ],
    );
    assert.equal(figure(result, 'Total batch weight').toFixed(3), '69444.444');
  });

  it('should add a Seasoning group in percent of the meat weight', () => {
    // own example, derived: 10 kg meat × 1.5 % = 150 g salt, × 0.5 % = 50 g pepper; 10.2 kg in all.
    const formula = we25({
      ingredients: [
        { name: 'salt', pct: 1.5 },
        { name: 'black pepper', pct: 0.5 },
      ],
    });
    const result = calculateBlend(formula, { total: dec('10000') });
    const seasoning = result.groups[1];
    assert.equal(seasoning.title, 'Seasoning');
    assert.equal(seasoning.percentOf, 'meat weight');
    assert.deepEqual(grams(result, 'Seasoning'), ['150.000', '50.000']);
    assert.ok(figure(result, 'Total batch weight').equals(dec('10200')));
    // The blend fat is the meat's: seasoning does not change what the trims were mixed to.
    assert.ok(figure(result, 'Blend fat').equals(dec('20')));
  });
});
