import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { type Decimal, dec } from '../../decimal.ts';
import { calculateBlend } from './calculate-blend.ts';
import { figure, we25 } from './blend-spec-helpers.ts';

describe('calculateBlend, fat standards', () => {
  it('should fail the ground-beef standard at 32 % fat without refusing the batch', () => {
    // source: 9 CFR 319.15(a), ≤ 30 % fat (read in training material quoting it). Own blend,
    // derived: 20 % and
    // 50 % trims at 32 %: parts 18 and 12, 60 % and 40 %; fat 0.6 × 20 + 0.4 × 50 = 32 %.
    const formula = we25({
      standard: 'ground-beef',
      components: [
        { key: 'lean', name: '80/20 trim', fat: 20 },
        { key: 'fat', name: '50/50 trim', fat: 50 },
      ],
      target: { fat: 32 },
    });
    const [check] = calculateBlend(formula, { total: dec('10000') }).checks;
    assert.equal(check.status, 'fail');
    assert.equal(check.critical, false);
    assert.equal(check.comparison, 'at-most');
    assert.ok(check.value.equals(dec('32')));
    assert.ok(check.limit.equals(dec('30')));
    assert.match(check.source, /9 CFR 319\.15\(a\)/);
  });

  it('should pass the ground-beef standard at exactly 30 % fat', () => {
    // source: 9 CFR 319.15(a): "≤ 30 %" includes 30
    const result = calculateBlend(we25({ standard: 'ground-beef' }), {
      total: dec('1000'),
      targetFat: dec('30'),
    });
    assert.equal(result.checks[0].status, 'pass');
  });

  it('should check fresh pork sausage against 50 % fat', () => {
    // source: 9 CFR 319.141, ≤ 50 % fat (as stated in The National Provisioner)
    const formula = we25({
      species: 'pork',
      standard: 'fresh-pork-sausage',
      components: [
        { key: 'shoulder', name: 'pork shoulder', fat: 25 },
        { key: 'fatback', name: 'fatback', fat: 85 },
      ],
      target: { fat: 45 },
    });
    const [check] = calculateBlend(formula, { total: dec('1000') }).checks;
    assert.equal(check.status, 'pass');
    assert.ok(check.limit.equals(dec('50')));
    assert.match(check.source, /9 CFR 319\.141/);
  });

  it('should make no check when the formula names no standard', () => {
    assert.deepEqual(calculateBlend(we25(), { total: dec('1000') }).checks, []);
  });
});

describe('calculateBlend, portions', () => {
  it('should cut 176 quarter-pound portions from 20 kg with 41.93572 g over', () => {
    // source: NIST SP 811 (2008), App. B.8, derived: 453.59237 / 4 = 113.3980925 g; own
    // arithmetic: 176 × 113.3980925 = 19958.06428 g; 20000 − 19958.06428 = 41.93572 g.
    const result = calculateBlend(we25({ portion: '4 oz' }), { total: dec('20000') });
    assert.ok(result.portions?.pieceGrams.equals(dec('113.3980925')));
    assert.equal(result.portions?.count, 176);
    assert.ok(result.portions?.remainderGrams.equals(dec('41.93572')));
    assert.equal(result.inputs.at(-1)?.label, 'Portion');
  });

  it('should prefer --portion to the formula portion and count the seasoning in', () => {
    // own example, derived: 10 kg meat + 2 % seasoning = 10 200 g ÷ 150 g = 68 portions, 0 over.
    const formula = we25({ portion: '4 oz', ingredients: [{ name: 'salt', pct: 2 }] });
    const result = calculateBlend(formula, { total: dec('10000'), portion: dec('150') });
    assert.equal(result.portions?.count, 68);
    assert.ok(result.portions?.remainderGrams.isZero());
  });

  it('should give the cooked portion at the cook yield', () => {
    // derived: the quarter pound (NIST SP 811) at an own 72 % cook yield (cooked ÷ raw, USDA Table
    // of Cooking Yields); 113.3980925 × 0.72 = 81.6466266 g
    const result = calculateBlend(we25({ portion: '0.25 lb', yields: { cook: 72 } }), {
      total: dec('20000'),
    });
    assert.ok(figure(result, 'Cooked portion').equals(dec('81.6466266')));
  });

  it('should give no portions when neither the batch nor the formula has one', () => {
    assert.equal(calculateBlend(we25(), { total: dec('1000') }).portions, undefined);
  });
});

describe('calculateBlend, cautions and echoes', () => {
  it('should give the ground-meat, keep-cold and local-codes cautions in that order', () => {
    const ids = calculateBlend(we25(), { total: dec('1000') }).cautions.map((c) => c.id);
    assert.deepEqual(ids, ['ground-meat-cooking', 'keep-cold', 'local-codes']);
  });

  it('should give the poultry temperature for a poultry blend', () => {
    const ids = calculateBlend(we25({ species: 'poultry' }), { total: dec('1000') }).cautions.map(
      (c) => c.id,
    );
    // source: USDA FSIS Safe Minimum Internal Temperature Chart, all poultry 165 °F
    assert.deepEqual(ids, ['poultry-cooking', 'keep-cold', 'local-codes']);
  });

  it('should give one temperature, poultry’s, for a mixed blend whose meats are not named', () => {
    const ids = calculateBlend(we25({ species: 'mixed' }), { total: dec('1000') }).cautions.map(
      (c) => c.id,
    );
    // source: USDA FSIS Safe Minimum Internal Temperature Chart, 165 °F (poultry) is its highest
    assert.deepEqual(ids, ['unnamed-mixture-cooking', 'keep-cold', 'local-codes']);
  });

  it('should declare the seasoning allergens before the local-codes caution', () => {
    const formula = we25({
      ingredients: [
        { name: 'milk powder', pct: 2, allergens: ['milk'] },
        { name: 'soy sauce', pct: 1, allergens: ['wheat', 'soy'] },
      ],
    });
    const result = calculateBlend(formula, { total: dec('1000') });
    assert.deepEqual(result.allergens, ['milk', 'wheat', 'soy']);
    assert.deepEqual(
      result.cautions.map((c) => c.id),
      ['ground-meat-cooking', 'keep-cold', 'allergens', 'local-codes'],
    );
  });

  it('should echo the inputs and carry the steps and notes of the formula', () => {
    const formula = we25({
      steps: ['Grind cold.'],
      notes: 'House grind for burgers.',
      portion: '150 g',
    });
    const result = calculateBlend(formula, { total: dec('1000') });
    assert.deepEqual(
      result.inputs.map((f) => [f.label, (f.value as Decimal).toString(), f.note]),
      [
        ['Target fat', '20', 'from the formula'],
        ['Meat weight', '1000', undefined],
        ['Portion', '150', 'from the formula (150 g)'],
      ],
    );
    assert.deepEqual(result.steps, ['Grind cold.']);
    assert.equal(result.notes, 'House grind for burgers.');
    assert.deepEqual(result.formula, { id: 'house-grind', title: 'House grind', kind: 'blend' });
  });
});
