import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { calculate } from '../calculation/calculate.ts';
import { bunDough } from '../calculation/dough/dough-fixtures.ts';
import { we25 } from '../calculation/blend/blend-spec-helpers.ts';
import { cure } from '../calculation/cure/cure-spec-helpers.ts';
import { dec } from '../decimal.ts';
import { presentResult } from '../presentation/present-result.ts';
import { moneyText } from '../presentation/money.ts';
import { parseMass } from '../units/mass.ts';
import { type CostInput, batchCost, planCost } from './batch-cost.ts';
import { finishedWeight } from './finished-weight.ts';
import { pricePerKg } from './stock-measure.ts';

/** A line from a lot received at a price per unit. */
function lot(name: string, grams: string, perUnit: string, unit: 'kg' | 'lb' = 'kg'): CostInput {
  return {
    name,
    amount: dec(grams),
    source: 'lot',
    lot: 'R261201-01',
    price: { perUnit: dec(perUnit), unit },
  };
}

// Invented Quillmoor Smokehouse bacon: 10 kg green belly, salt 2.5 %, curing salt 0.25 %, sugar
// 1 %, and a cook yield of 88 % (a 12 % loss).
const BACON = cure({
  ingredients: [
    { name: 'salt', pct: 2.5, salt: 100 },
    { name: 'curing salt', pct: 0.25, nitrite: 6.25, salt: 93.75 },
    { name: 'sugar', pct: 1 },
  ],
  yields: { cook: 88 },
});
const bacon = presentResult(calculate(BACON, { meat: dec('10000') }), 'metric');

// Priced by hand:
//   belly, its lot at 8.80 a kg:           10 000 g ÷ 1000 × 8.80       = 88.00
//   salt, its lot at 1.20 a kg:               250 g ÷ 1000 × 1.20       =  0.30
//   curing salt, no lot: latest 6.00 a kg:     25 g ÷ 1000 × 6.00       =  0.15
//   sugar, its lot at 4.5359237 a lb:         100 g ÷ 453.59237 × 4.5359237 = 1.00
//   total                                                                 89.45
// Finished: 10 000 g × 88 % = 8 800 g, so 89.45 ÷ 8.8 = 10.1647727… a kg → 10.16.
// 150 g portions of the finished bacon: 8 800 ÷ 150 = 58.67 → 58 whole portions; one costs
// 89.45 × 150 ÷ 8 800 = 1.5247159… → 1.52. (derived: cost ÷ weight; the pound is 453.59237 g,
// source: NIST SP 811 (2008), Appendix B.8)
const BACON_LINES: CostInput[] = [
  lot('pork belly', '10000', '8.80'),
  lot('salt', '250', '1.20'),
  {
    name: 'curing salt',
    amount: dec('25'),
    source: 'latest-price',
    price: { perUnit: dec('6.00'), unit: 'kg' },
  },
  lot('sugar', '100', '4.5359237', 'lb'),
];

describe('batchCost', () => {
  it('should cost a cure with a 12 % loss at 10.16 a finished kilogram and 1.52 a 150 g portion', () => {
    const weight = finishedWeight(bacon, dec('150'));
    assert.equal(weight.finishedGrams.toString(), '8800');
    const cost = batchCost(BACON_LINES, weight);
    assert.equal(cost.total.toString(), '89.45');
    assert.equal(moneyText(cost.perFinishedKg ?? dec(0)), '10.16');
    assert.ok(cost.perFinishedKg?.equals(dec('89.45').div('8.8')));
    assert.equal(cost.portion?.count, 58);
    assert.equal(moneyText(cost.portion?.cost ?? dec(0)), '1.52');
    assert.ok(cost.complete);
    assert.deepEqual(cost.latestPriced, ['curing salt']);
  });

  // The same lines with the sugar unpriced: 89.45 − 1.00 = 88.45, and the batch is not complete.
  it('should leave a line with no price out of the total and say why', () => {
    const lines = BACON_LINES.map((line) =>
      line.name === 'sugar'
        ? { ...line, price: undefined, unpriced: 'never received with a price' }
        : line,
    );
    const cost = batchCost(lines, finishedWeight(bacon));
    assert.equal(cost.total.toString(), '88.45');
    assert.equal(cost.complete, false);
    assert.deepEqual(cost.unpriced, [{ name: 'sugar', reason: 'never received with a price' }]);
    assert.equal(cost.portion, null, 'a cure has no portion of its own');
  });

  // Nothing priced is no cost at all, not a cost of 0.00 a kg.
  it('should give no cost per kilogram when no line has a price', () => {
    const lines = BACON_LINES.map((line) => ({ ...line, price: undefined }));
    const cost = batchCost(lines, finishedWeight(bacon, dec('150')));
    assert.equal(cost.total.toString(), '0');
    assert.equal(cost.perFinishedKg, null);
    assert.equal(cost.portion, null);
  });

  // Without yields a cure finishes at its green weight: 89.45 ÷ 10 = 8.945 → 8.95 (half-up).
  it('should take the green weight of a cure without yields, rounding 8.945 up to 8.95', () => {
    const plain = presentResult(
      calculate({ ...BACON, yields: undefined }, { meat: dec('10000') }),
      'metric',
    );
    const cost = batchCost(BACON_LINES, finishedWeight(plain));
    assert.equal(cost.finishedGrams.toString(), '10000');
    assert.equal(moneyText(cost.perFinishedKg ?? dec(0)), '8.95');
  });

  // A blend of 10 % and 50 % trim to 20 % fat, 10 kg: 7.5 kg lean and 2.5 kg fat trim (the
  // Pearson square: parts 30 and 10). Lean at 6.00 a kg: 45.00; fat trim at 2.00: 5.00; 50.00.
  // A 2 % forming loss leaves 9 800 g raw, cut into 4 oz (113.3980925 g) patties:
  // 9 800 ÷ 113.398 = 86.4 → 86, each 50 × 113.3980925 ÷ 9 800 = 0.57856… → 0.58. Cooked at
  // 72 %: 9 800 × 0.72 = 7 056 g finished, 50 ÷ 7.056 = 7.0861… a kg → 7.09.
  it('should cost a blend per cooked kilogram and per raw patty', () => {
    const formula = we25({ portion: '4 oz', loss_pct: 2, yields: { cook: 72 } });
    const result = presentResult(calculate(formula, { total: dec('10000') }), 'metric');
    const weight = finishedWeight(result);
    assert.equal(weight.finishedGrams.toString(), '7056');
    const cost = batchCost([lot('lean', '7500', '6.00'), lot('fat trim', '2500', '2.00')], weight);
    assert.equal(cost.total.toString(), '50');
    assert.equal(moneyText(cost.perFinishedKg ?? dec(0)), '7.09');
    assert.equal(cost.portion?.count, 86);
    assert.ok(cost.portion?.grams.equals(parseMass('4 oz')));
    assert.equal(moneyText(cost.portion?.cost ?? dec(0)), '0.58');
  });

  // 24 buns of 90 g with a 3 % loss allowance: the pieces are 24 × 90 = 2 160 g, the allowance
  // is lost. Materials 10.80: 10.80 ÷ 2.16 = 5.00 a kg, 10.80 × 90 ÷ 2 160 = 0.45 a bun.
  it('should cost a dough per piece, the loss allowance carried by the pieces', () => {
    const formula = bunDough({ piece: '90 g', loss_pct: 3 });
    const result = presentResult(calculate(formula, { pieces: 24 }), 'metric');
    const cost = batchCost([lot('dough materials', '1000', '10.80')], finishedWeight(result));
    assert.equal(cost.finishedGrams.toString(), '2160');
    assert.equal(moneyText(cost.perFinishedKg ?? dec(0)), '5.00');
    assert.equal(cost.portion?.count, 24);
    assert.equal(moneyText(cost.portion?.cost ?? dec(0)), '0.45');
  });
});

describe('planCost', () => {
  // 89.45 + 50.00 = 139.45 for 120 burgers: 1.1620833… → 1.16 each.
  it('should add its batches and share them over the units served', () => {
    const bacon = batchCost(
      BACON_LINES,
      finishedWeight(presentResult(calculate(BACON, { meat: dec('10000') }), 'metric')),
    );
    const grind = batchCost([lot('lean', '7500', '6.00'), lot('fat trim', '2500', '2.00')], {
      finishedGrams: dec('10000'),
      basis: 'the blend',
    });
    const plan = planCost([bacon, grind], 120);
    assert.equal(plan.total.toString(), '139.45');
    assert.equal(moneyText(plan.perUnit), '1.16');
    assert.throws(() => planCost([bacon], 0), RangeError);
  });
});

describe('money and prices', () => {
  // Half-up to the cent: 2.345 → 2.35, 0.005 → 0.01, 2.344 → 2.34.
  it('should round to the cent half-up only when shown', () => {
    assert.equal(moneyText(dec('2.345')), '2.35');
    assert.equal(moneyText(dec('0.005')), '0.01');
    assert.equal(moneyText(dec('2.344')), '2.34');
  });

  // 4.5359237 a pound is 4.5359237 × 1000 ÷ 453.59237 = 10 a kilogram.
  it('should turn a price per pound into a price per kilogram', () => {
    assert.equal(pricePerKg('lb', dec('4.5359237')).toString(), '10');
    assert.equal(pricePerKg('g', dec('0.012')).toString(), '12');
  });
});
