import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { type Decimal, dec } from '../../decimal.ts';
import { GRAMS_PER_POUND } from '../../units/mass.ts';
import { plannedSize } from '../plan/plan-batch-size.ts';
import { calculateBlend } from './calculate-blend.ts';
import { figure, we25 } from './blend-spec-helpers.ts';

// source (the loss itself): grinder and forming loss, typically 1–3 % of a blend, common
// practice, no source. The pound: NIST SP 811 (2008), Appendix B.8, 453.59237 g.

describe('calculateBlend, loss allowance', () => {
  it('should cut 98 quarter-pound portions from 25 lb at 2 % loss', () => {
    // own arithmetic: 25 lb × 0.98 = 24.5 lb ÷ 0.25 lb = 98, nothing over;
    // 25 × 453.59237 = 11339.80925 g, × 0.98 = 11113.013065 g.
    const result = calculateBlend(we25({ portion: '4 oz', loss_pct: 2 }), {
      total: GRAMS_PER_POUND.times(25),
    });
    assert.equal(result.portions?.count, 98);
    assert.ok(result.portions?.remainderGrams.isZero());
    assert.ok(figure(result, 'After grinding and forming loss').equals(dec('11113.013065')));
    const loss = result.inputs.find((f) => f.label === 'Loss allowance');
    assert.ok(loss, 'the sheet says what the loss is');
    assert.equal(loss.kind, 'percent');
    assert.ok((loss.value as Decimal).equals(dec('2')));
    assert.match(loss.note ?? '', /grind/);
  });

  it('should cut 100 quarter-pound portions from 25 lb without a loss', () => {
    // own arithmetic: 25 lb ÷ 0.25 lb = 100
    const result = calculateBlend(we25({ portion: '4 oz' }), { total: GRAMS_PER_POUND.times(25) });
    assert.equal(result.portions?.count, 100);
    assert.equal(
      result.inputs.find((f) => f.label === 'Loss allowance'),
      undefined,
    );
  });

  it('should cook what is left after the loss, and work a wanted weight back through both', () => {
    // own arithmetic: 980 g cooked wanted at 80 % cook yield and 2 % loss: 980 ÷ 0.8 = 1225 g
    // formed, ÷ 0.98 = 1250 g of meat (no seasoning); split 30 : 10 as the own Pearson example
    // (lean 90/10 and 50/50 trim at 20 % fat): 937.5 g and 312.5 g.
    const result = calculateBlend(we25({ loss_pct: 2, yields: { cook: 80 } }), {
      want: dec('980'),
    });
    assert.ok(figure(result, 'Total batch weight').equals(dec('1250')));
    assert.ok(figure(result, 'After grinding and forming loss').equals(dec('1225')));
    const cook = result.yields?.find((stage) => stage.step === 'cook');
    assert.ok(cook?.grams.equals(dec('980')));
  });
});

describe('plannedSize, blend loss allowance', () => {
  it('should plan 25 lb of meat for 98 quarter-pound portions at 2 % loss', () => {
    // own arithmetic: 98 × 113.3980925 g ÷ (1 − 0.02) = 11113.013065 ÷ 0.98 = 11339.80925 g
    // = 25 lb (453.59237 g to the pound, NIST SP 811).
    const size = plannedSize({
      formula: we25({ portion: '4 oz', loss_pct: 2 }),
      purposes: [],
      portions: dec('98'),
      pieces: dec('0'),
      grams: dec('0'),
      sizes: {},
      served: true,
      goesOn: [],
    });
    assert.ok(dec(String(size.batch.total).replace(' g', '')).equals(GRAMS_PER_POUND.times(25)));
  });
});
