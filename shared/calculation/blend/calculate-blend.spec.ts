import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { type Decimal, dec } from '../../decimal.ts';
import type { BlendFormula } from '../../formula/formula-types.ts';
import { BatchError } from '../batch-error.ts';
import type { CalcResult } from '../calc-result.ts';
import { BEFORE_TRIM } from '../yields.ts';
import { calculateBlend } from './calculate-blend.ts';

/** WE-25's trims: lean 90/10 (10 % fat) and 50/50 (50 % fat), 20 % fat wanted. */
function we25(extra: Partial<BlendFormula> = {}): BlendFormula {
  return {
    formula: 1,
    id: 'house-grind',
    title: 'House grind',
    kind: 'blend',
    species: 'beef',
    components: [
      { key: 'lean', name: 'lean 90/10 trim', fat: 10 },
      { key: 'fat', name: '50/50 trim', fat: 50 },
    ],
    target: { fat: 20 },
    ...extra,
  };
}

function figure(result: CalcResult, label: string): Decimal {
  const found = result.figures.find((f) => f.label === label);
  assert.ok(found, `no figure "${label}"`);
  return found.value as Decimal;
}

function grams(result: CalcResult, group: string): string[] {
  const found = result.groups.find((g) => g.title === group);
  assert.ok(found, `no group "${group}"`);
  return found.lines.map((line) => line.grams.toFixed(3));
}

function batchError(option: string | undefined, pattern: RegExp): (error: unknown) => boolean {
  return (error) => {
    assert.ok(error instanceof BatchError, `not a BatchError: ${String(error)}`);
    assert.equal(error.option, option);
    assert.match(error.message, pattern);
    return true;
  };
}

describe('calculateBlend, sizes', () => {
  it('should blend 100 kg at 20 % fat from 75 kg of 10 % and 25 kg of 50 % trim', () => {
    // source: check-values WE-25 (P-1): lean = 100 × 30/40 = 75.000 kg, 50/50 = 25.000 kg;
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
    assert.ok(figure(result, 'blend fat').equals(dec('20')));
    assert.ok(figure(result, 'chemical lean').equals(dec('80')));
    assert.ok(figure(result, 'total batch weight').equals(dec('100000')));
    assert.equal(result.groups.length, 1);
  });

  it('should add 4 kg of 50 % trim to 12 kg of 10 % trim on hand', () => {
    // own example, derived: 12 × (10 − 20) ÷ (20 − 50) = 4 kg of 50/50; total 16 kg;
    // 1.2 + 2.0 = 3.2 kg fat = 20 % of 16 kg.
    const result = calculateBlend(we25(), { onHand: { key: 'lean', grams: dec('12000') } });
    assert.deepEqual(grams(result, 'Meat'), ['12000.000', '4000.000']);
    assert.ok(figure(result, 'blend fat').equals(dec('20')));
    assert.ok(figure(result, 'total batch weight').equals(dec('16000')));
    assert.equal(result.inputs[1].label, 'on hand: lean 90/10 trim');
  });

  it('should keep the formula order when the second component is on hand', () => {
    // own example, derived: 5 × (50 − 20) ÷ (20 − 10) = 15 kg of 10 % trim; total 20 kg.
    const result = calculateBlend(we25(), { onHand: { key: 'fat', grams: dec('5000') } });
    assert.deepEqual(grams(result, 'Meat'), ['15000.000', '5000.000']);
  });

  it('should read chemical lean as 100 minus fat (CL 90 is 10 % fat)', () => {
    // source: WE-25 again, with the lean trim given as CL 90 and the target as CL 80
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
    assert.ok(figure(result, 'chemical lean').equals(dec('80')));
  });

  it('should use --target-fat instead of the formula target', () => {
    // own example, derived: 30 % from 10 % and 50 %: parts 20 and 20, half each of 10 kg.
    const result = calculateBlend(we25(), { total: dec('10000'), targetFat: dec('30') });
    assert.deepEqual(grams(result, 'Meat'), ['5000.000', '5000.000']);
    assert.equal(result.inputs[0].note, 'from --target-fat');
  });

  it('should work back from 50 kg cooked at a 72 % cook yield to 69.444 kg raw', () => {
    // source: check-values WE-29 (P-5; USDA ARS Table of Cooking Yields): 50 / 0.72 = 69.444 kg,
    // split by WE-25: 75 % = 52.083 kg, 25 % = 17.361 kg.
    const result = calculateBlend(we25({ yields: { cook: 72 } }), { want: dec('50000') });
    assert.equal(figure(result, 'total batch weight').toFixed(3), '69444.444');
    assert.deepEqual(grams(result, 'Meat'), ['52083.333', '17361.111']);
    assert.equal(result.yields?.[0].step, 'cook');
    assert.equal(result.yields?.[0].grams.toFixed(3), '50000.000');
  });

  it('should take the finished weight as the raw weight when there are no yields', () => {
    const result = calculateBlend(we25(), { want: dec('8000') });
    assert.ok(figure(result, 'total batch weight').equals(dec('8000')));
    assert.equal(result.yields, undefined);
  });

  it('should count seasoning into the cooked weight but not into the trim', () => {
    // own example, derived: 50 kg cooked at 72 % → 69.444444 kg raw batch (WE-29); seasoning
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
    assert.equal(result.groups[0].lines[0].grams.plus(result.groups[0].lines[1].grams).toFixed(3), '68082.789');
    assert.deepEqual(
      result.yields?.map((s) => [s.step, s.grams.toFixed(3)]),
      [
        [BEFORE_TRIM, '85103.486'],
        ['cook', '50000.000'],
      ],
    );
    assert.equal(figure(result, 'total batch weight').toFixed(3), '69444.444');
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
    assert.ok(figure(result, 'total batch weight').equals(dec('10200')));
    // The blend fat is the meat's: seasoning does not change what the trims were mixed to.
    assert.ok(figure(result, 'blend fat').equals(dec('20')));
  });
});

describe('calculateBlend, refusals', () => {
  it('should refuse 20 % fat from trimmings at 15 % and 18 % fat', () => {
    // source: check-values P-2 (DERIVED): the target must lie between the component fats
    const formula = we25({
      components: [
        { key: 'a', name: 'chuck trim', fat: 18 },
        { key: 'b', name: 'round trim', fat: 15 },
      ],
    });
    assert.throws(
      () => calculateBlend(formula, { total: dec('1000') }),
      batchError(undefined, /^20 % fat cannot be made from trimmings at 15 % and 18 % fat/),
    );
  });

  it('should name --target-fat when that is what cannot be made', () => {
    assert.throws(
      () => calculateBlend(we25(), { total: dec('1000'), targetFat: dec('55') }),
      batchError('target-fat', /55 % fat cannot be made from trimmings at 10 % and 50 % fat/),
    );
    assert.throws(
      () => calculateBlend(we25(), { total: dec('1000'), targetFat: dec('101') }),
      batchError('target-fat', /between 0 and 100/),
    );
  });

  it('should refuse a different target from two trimmings of equal fat', () => {
    const formula = we25({
      components: [
        { key: 'a', name: 'chuck trim', fat: 15 },
        { key: 'b', name: 'round trim', fat: 15 },
      ],
    });
    assert.throws(
      () => calculateBlend(formula, { total: dec('1000') }),
      batchError(undefined, /20 % fat cannot be made from trimmings at 15 % and 15 % fat/),
    );
  });

  it('should take all of one trimming when both are at the target', () => {
    const formula = we25({
      components: [
        { key: 'a', name: 'chuck trim', fat: 20 },
        { key: 'b', name: 'round trim', fat: 20 },
      ],
    });
    assert.deepEqual(grams(calculateBlend(formula, { total: dec('1000') }), 'Meat'), ['1000.000', '0.000']);
  });

  it('should ask for a size naming --total, --on-hand and --want when none is given', () => {
    assert.throws(() => calculateBlend(we25(), {}), batchError(undefined, /--total.*--on-hand.*--want/));
  });

  it('should refuse several sizes at once', () => {
    assert.throws(
      () => calculateBlend(we25(), { total: dec('1000'), want: dec('800') }),
      batchError('want', /only one of --total, --on-hand or --want, not --total and --want/),
    );
  });

  it('should list the formula keys for an unknown on-hand key', () => {
    assert.throws(
      () => calculateBlend(we25(), { onHand: { key: 'belly', grams: dec('1000') } }),
      batchError('on-hand', /"belly".*lean and fat/),
    );
  });

  it('should refuse an on-hand trimming when the target is the other trimming’s own fat', () => {
    assert.throws(
      () => calculateBlend(we25(), { onHand: { key: 'lean', grams: dec('1000') }, targetFat: dec('50') }),
      batchError('on-hand', /unlimited/),
    );
  });

  it('should refuse sizes that are not more than 0 g', () => {
    assert.throws(() => calculateBlend(we25(), { total: dec('0') }), batchError('total', /more than 0/));
    assert.throws(() => calculateBlend(we25(), { want: dec('-1') }), batchError('want', /more than 0/));
    assert.throws(
      () => calculateBlend(we25(), { total: dec('1000'), portion: dec('0') }),
      batchError('portion', /more than 0/),
    );
  });
});

describe('calculateBlend, fat standards', () => {
  it('should fail the ground-beef standard at 32 % fat without refusing the batch', () => {
    // source: check-values S-5 (9 CFR 319.15(a), ≤ 30 % fat). Own blend, derived: 20 % and
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
    // source: check-values S-5: "≤ 30 %" includes 30
    const result = calculateBlend(we25({ standard: 'ground-beef' }), { total: dec('1000'), targetFat: dec('30') });
    assert.equal(result.checks[0].status, 'pass');
  });

  it('should check fresh pork sausage against 50 % fat', () => {
    // source: check-values S-6 (9 CFR 319.141, ≤ 50 % fat)
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
    // source: check-values U-7 (453.59237 / 4 = 113.3980925 g, from NIST SP 811); own
    // arithmetic: 176 × 113.3980925 = 19958.06428 g; 20000 − 19958.06428 = 41.93572 g.
    const result = calculateBlend(we25({ portion: '4 oz' }), { total: dec('20000') });
    assert.ok(result.portions?.pieceGrams.equals(dec('113.3980925')));
    assert.equal(result.portions?.count, 176);
    assert.ok(result.portions?.remainderGrams.equals(dec('41.93572')));
    assert.equal(result.inputs.at(-1)?.label, 'portion');
  });

  it('should prefer --portion to the formula portion and count the seasoning in', () => {
    // own example, derived: 10 kg meat + 2 % seasoning = 10 200 g ÷ 150 g = 68 portions, 0 over.
    const formula = we25({ portion: '4 oz', ingredients: [{ name: 'salt', pct: 2 }] });
    const result = calculateBlend(formula, { total: dec('10000'), portion: dec('150') });
    assert.equal(result.portions?.count, 68);
    assert.ok(result.portions?.remainderGrams.isZero());
  });

  it('should give the cooked portion at the cook yield', () => {
    // source: U-7 portion and WE-29's 72 % cook yield; 113.3980925 × 0.72 = 81.6466266 g
    const result = calculateBlend(we25({ portion: '0.25 lb', yields: { cook: 72 } }), { total: dec('20000') });
    assert.ok(figure(result, 'cooked portion').equals(dec('81.6466266')));
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
    const ids = calculateBlend(we25({ species: 'poultry' }), { total: dec('1000') }).cautions.map((c) => c.id);
    assert.deepEqual(ids, ['ground-poultry-cooking', 'keep-cold', 'local-codes']);
  });

  it('should give both temperatures for a mixed blend, which may hold poultry', () => {
    const ids = calculateBlend(we25({ species: 'mixed' }), { total: dec('1000') }).cautions.map((c) => c.id);
    assert.deepEqual(ids, ['ground-meat-cooking', 'ground-poultry-cooking', 'keep-cold', 'local-codes']);
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
    const formula = we25({ steps: ['Grind cold.'], notes: 'House grind for burgers.', portion: '150 g' });
    const result = calculateBlend(formula, { total: dec('1000') });
    assert.deepEqual(
      result.inputs.map((f) => [f.label, (f.value as Decimal).toString(), f.note]),
      [
        ['target fat', '20', 'from the formula'],
        ['meat weight', '1000', undefined],
        ['portion', '150', 'from the formula (150 g)'],
      ],
    );
    assert.deepEqual(result.steps, ['Grind cold.']);
    assert.equal(result.notes, 'House grind for burgers.');
    assert.deepEqual(result.formula, { id: 'house-grind', title: 'House grind', kind: 'blend' });
  });
});
