import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { dec } from '../../decimal.ts';
import type { BlendFormula } from '../../formula/formula-types.ts';
import type { BatchInput } from '../batch-input.ts';
import { calculateBlend } from './calculate-blend.ts';
import { batchError, figure, grams, we25 } from './blend-spec-helpers.ts';

/** The own example trims, lean 90/10 and 50/50, with a third of 30 % fat between them. */
function threeTrims(extra: Partial<BlendFormula> = {}): BlendFormula {
  return we25({
    components: [
      { key: 'lean', name: 'lean 90/10 trim', fat: 10 },
      { key: 'fat', name: '50/50 trim', fat: 50 },
      { key: 'plate', name: 'plate 70/30', lean: 70 },
    ],
    ...extra,
  });
}

const kg = (n: string) => dec(n).times(1000);

/** Asserts that a batch of the formula is refused, naming the option, with the message. */
function refuses(
  batch: BatchInput,
  option: string | undefined,
  message: RegExp,
  formula: BlendFormula = threeTrims(),
): void {
  assert.throws(() => calculateBlend(formula, batch), batchError(option, message));
}

describe('calculateBlend, more than two components', () => {
  it('should balance 10 % and 50 % trims around 20 kg of 30 % on hand for 100 kg at 20 %', () => {
    // derived from the mass and fat balances of a linear blend, with fixed amounts; own
    // arithmetic: fat needed 100 × 20 = 2000 kg·%; on hand 20 × 30 = 600; the other 80 kg carry
    // 1400, i.e. 17.5 %; Pearson square (meat-evaluation training material) on 10 % and 50 %:
    // parts 32.5 and 7.5 of 40 → 65 kg and 15 kg.
    // Check: 6.5 + 7.5 + 6.0 = 20 kg fat in 100 kg.
    const result = calculateBlend(threeTrims(), {
      total: kg('100'),
      onHand: [{ key: 'plate', grams: kg('20') }],
    });
    assert.deepEqual(grams(result, 'Meat'), ['65000.000', '15000.000', '20000.000']);
    assert.ok(figure(result, 'Blend fat').equals(dec('20')));
  });

  it('should add the one free trim to two on hand when no meat weight is given', () => {
    // derived from the mass and fat balances; own arithmetic: on hand 20 kg at 30 % and 5 kg
    // at 50 %
    // carry 600 + 250 = 850 kg·% in 25 kg; fat balance 850 + 10·m = 20·(25 + m) → m = 350 ÷ 10
    // = 35 kg of 10 % trim; 60 kg at 1200 kg·% = 20 %.
    const result = calculateBlend(threeTrims(), {
      onHand: [
        { key: 'plate', grams: kg('20') },
        { key: 'fat', grams: kg('5') },
      ],
    });
    assert.deepEqual(grams(result, 'Meat'), ['35000.000', '5000.000', '20000.000']);
    assert.ok(figure(result, 'Total batch weight').equals(kg('60')));
  });

  it('should solve five components with three on hand', () => {
    // derived from the mass and fat balances; own arithmetic: on hand chuck 30 kg at 15 %, brisket
    // 20 kg at 30 %, plate 10 kg at 35 %: 450 + 600 + 350 = 1400 kg·%; the other 40 kg carry
    // 2000 − 1400 = 600 (15 %); from 10 % and 50 %: (600 − 50 × 40) ÷ (10 − 50) = 35 kg of lean,
    // 5 kg of fat trim. Check: 350 + 450 + 600 + 350 + 250 = 2000 = 20 % of 100 kg.
    const formula = we25({
      components: [
        { key: 'lean', name: 'lean 90/10', fat: 10 },
        { key: 'chuck', name: 'chuck 85/15', fat: 15 },
        { key: 'brisket', name: 'brisket 70/30', fat: 30 },
        { key: 'plate', name: 'plate 65/35', fat: 35 },
        { key: 'fat', name: '50/50 trim', fat: 50 },
      ],
    });
    const result = calculateBlend(formula, {
      total: kg('100'),
      onHand: [
        { key: 'chuck', grams: kg('30') },
        { key: 'brisket', grams: kg('20') },
        { key: 'plate', grams: kg('10') },
      ],
    });
    assert.deepEqual(grams(result, 'Meat'), [
      '35000.000',
      '30000.000',
      '20000.000',
      '10000.000',
      '5000.000',
    ]);
  });

  it('should refuse a rest that the free trims cannot reach, naming them', () => {
    // own arithmetic: 90 kg of 10 % on hand in 100 kg at 20 %: the other 10 kg must carry
    // 2000 − 900 = 1100 kg·%, i.e. 110 % fat: no trim is that fat.
    refuses(
      {
        total: kg('100'),
        onHand: [{ key: 'lean', grams: kg('90') }],
      },
      'on-hand',
      /10000 g must be 110 % fat.*50\/50 trim.*plate 70\/30.*cannot make/,
    );
  });

  it('should refuse more on hand than the batch', () => {
    refuses(
      {
        total: kg('100'),
        onHand: [{ key: 'plate', grams: kg('120') }],
      },
      'on-hand',
      /120000 g, more than the 100000 g batch/,
    );
  });

  it('should refuse on-hand amounts that no added trim can bring to the target', () => {
    // own arithmetic: 20 kg at 30 % and 10 kg at 10 %: 700 kg·% in 30 kg = 23.33 %; adding
    // 50 % trim only raises it, so 20 % cannot be reached.
    refuses(
      {
        onHand: [
          { key: 'plate', grams: kg('20') },
          { key: 'lean', grams: kg('10') },
        ],
      },
      'on-hand',
      /23\.33 % fat.*50\/50 trim \(50 % fat\) cannot bring it to 20 %/,
    );
  });

  it('should ask for what is on hand when more than two trims are free', () => {
    refuses(
      { total: kg('100') },
      undefined,
      /3 trimmings are free.*what is on hand of 1 more of them/,
    );
    refuses(
      { onHand: [{ key: 'plate', grams: kg('20') }] },
      'on-hand',
      /2 trimmings are free.*meat weight \(--total\)/,
    );
  });

  it('should refuse a meat weight when only one trim is left free to balance it', () => {
    refuses(
      { total: kg('100'), onHand: [{ key: 'lean', grams: kg('20') }] },
      'on-hand',
      /two trimmings must be left free/,
      we25(),
    );
  });

  it('should refuse every trim on hand, and a trim named twice', () => {
    refuses(
      {
        onHand: [
          { key: 'lean', grams: kg('20') },
          { key: 'fat', grams: kg('5') },
        ],
      },
      'on-hand',
      /every trimming is fixed/,
      we25(),
    );
    refuses(
      {
        onHand: [
          { key: 'plate', grams: kg('20') },
          { key: 'plate', grams: kg('5') },
        ],
      },
      'on-hand',
      /plate twice/,
    );
  });
});

describe('calculateBlend, fat tests', () => {
  it('should use the fat measured today instead of the formula’s, and say so', () => {
    // own arithmetic by the Pearson square: lean measured at 18 %: parts 50 − 20 = 30 and
    // 20 − 18 = 2 of 32;
    // 100 kg → 93.75 kg and 6.25 kg. Check: 16.875 + 3.125 = 20 kg fat.
    const result = calculateBlend(we25(), {
      total: kg('100'),
      fatTest: [{ key: 'lean', fat: dec('18') }],
    });
    assert.deepEqual(grams(result, 'Meat'), ['93750.000', '6250.000']);
    const lines = result.groups[0].lines.map((line) => line.name);
    assert.equal(lines[0], 'lean 90/10 trim (18 % fat, measured)');
    assert.equal(lines[1], '50/50 trim (50 % fat)');
    const input = result.inputs.find((f) => f.label === 'Fat test: lean 90/10 trim');
    assert.ok(input, 'the fat test is among the inputs');
    assert.match(input.note ?? '', /instead of the formula's 10 %/);
  });

  it('should refuse a fat test for an unknown trim', () => {
    refuses(
      { total: kg('1'), fatTest: [{ key: 'belly', fat: dec('30') }] },
      'fat-test',
      /"belly".*lean and fat/,
      we25(),
    );
  });
});
