import { describe, it } from 'node:test';
import assert from 'node:assert/strict';
import fc from 'fast-check';
import { type Decimal, dec, sum } from '../../decimal.ts';
import type { BlendFormula } from '../../formula/formula-types.ts';
import type { CalcResult } from '../calc-result.ts';
import { BatchError } from '../batch-error.ts';
import { calculateBlend } from './calculate-blend.ts';
import { blendFatPercent } from './pearson-square.ts';

/**
 * Arithmetic runs at 40 significant digits, so a split such as 2/3 of a batch cannot be exact in
 * decimal. The fat computed back may differ from the target in the last digits: at most about
 * 1e-36 % for these sizes (one rounding of a 40-digit quotient). We allow 1e-30.
 */
const TOLERANCE = dec('1e-30');

/** Two component fats and a target between them, in tenths of a percent (exact decimals). */
const fatsAndTarget = fc
  .tuple(
    fc.integer({ min: 0, max: 1000 }),
    fc.integer({ min: 0, max: 1000 }),
    fc.integer({ min: 0, max: 1000 }),
  )
  .map(([a, b, share]) => {
    const low = Math.min(a, b);
    const high = Math.max(a, b);
    // A target somewhere between low and high, both ends included.
    const target = low + Math.round(((high - low) * share) / 1000);
    return { a: a / 10, b: b / 10, target: dec(target).div(10) };
  });

/** A batch of 0.01 g to 1000 kg, to the hundredth of a gram. */
const totalGrams = fc.integer({ min: 1, max: 100_000_000 }).map((n) => dec(n).div(100));
/** A scale factor from 0.01 to 100. */
const factor = fc.integer({ min: 1, max: 10_000 }).map((n) => dec(n).div(100));

function formula(a: number, b: number): BlendFormula {
  return {
    formula: 1,
    id: 'prop',
    title: 'Property blend',
    kind: 'blend',
    components: [
      { key: 'a', name: 'trim a', fat: a },
      { key: 'b', name: 'trim b', fat: b },
    ],
    target: { fat: 20 },
  };
}

function meatGrams(result: CalcResult): Decimal[] {
  return result.groups[0].lines.map((line) => line.grams);
}

function fatFigure(result: CalcResult): Decimal {
  return result.figures.find((f) => f.label === 'Blend fat')?.value as Decimal;
}

function close(actual: Decimal, expected: Decimal): boolean {
  return actual
    .minus(expected)
    .abs()
    .lessThanOrEqualTo(TOLERANCE.times(Math.max(1, expected.abs().toNumber())));
}

describe('calculateBlend, properties', () => {
  it('should hit the target fat and add the masses up to the total exactly', () => {
    fc.assert(
      fc.property(fatsAndTarget, totalGrams, ({ a, b, target }, total) => {
        const result = calculateBlend(formula(a, b), { total, targetFat: target });
        const lines = meatGrams(result);
        assert.ok(sum(lines).equals(total), `${sum(lines)} ≠ ${total}`);
        assert.ok(lines.every((g) => !g.isNegative()));
        assert.ok(close(fatFigure(result), target), `fat ${fatFigure(result)} ≠ ${target}`);
      }),
    );
  });

  it('should scale every line by k when the total is scaled by k', () => {
    fc.assert(
      fc.property(fatsAndTarget, totalGrams, factor, ({ a, b, target }, total, k) => {
        const one = meatGrams(calculateBlend(formula(a, b), { total, targetFat: target }));
        const scaled = meatGrams(
          calculateBlend(formula(a, b), { total: total.times(k), targetFat: target }),
        );
        one.forEach((g, i) =>
          assert.ok(close(scaled[i], g.times(k)), `${scaled[i]} ≠ ${g} × ${k}`),
        );
      }),
    );
  });

  it('should give the same blend from the on-hand amount that a total blend used', () => {
    fc.assert(
      fc.property(fatsAndTarget, totalGrams, ({ a, b, target }, total) => {
        // Only a blend with both trims in it and the target away from the second fat can be
        // sized from the first component.
        fc.pre(a !== b && !target.equals(b) && !target.equals(a));
        const byTotal = meatGrams(calculateBlend(formula(a, b), { total, targetFat: target }));
        const onHand = [{ key: 'a', grams: byTotal[0] }];
        const byOnHand = meatGrams(calculateBlend(formula(a, b), { onHand, targetFat: target }));
        assert.ok(close(byOnHand[1], byTotal[1]), `${byOnHand[1]} ≠ ${byTotal[1]}`);
      }),
    );
  });

  it('should balance mass exactly and fat to the target for three to five components', () => {
    // derived, the mass and fat balances: Σ m = total and Σ m·fat = target × total. The blend
    // is built from known amounts, all but two are given as on hand, and the solver must find the
    // other two again, none negative.
    fc.assert(
      fc.property(blendOfMany, ({ fats, amounts, free }) => {
        const total = sum(amounts);
        const target = sum(amounts.map((m, i) => m.times(fats[i]))).div(total);
        fc.pre(!fats[free[0]].equals(fats[free[1]]));
        const onHand = amounts
          .map((grams, i) => ({ key: `c${i}`, grams }))
          .filter((_, i) => !free.includes(i));
        const result = calculateBlend(manyFormula(fats), { total, onHand, targetFat: target });
        const lines = meatGrams(result);
        assert.ok(sum(lines).equals(total), `${sum(lines)} ≠ ${total}`);
        assert.ok(lines.every((g) => !g.isNegative()));
        lines.forEach((g, i) => assert.ok(close(g, amounts[i]), `${g} ≠ ${amounts[i]}`));
        // The fat figure is kept to 20 places; the balance itself is checked unrounded.
        const fat = blendFatPercent(lines.map((grams, i) => ({ grams, fat: fats[i] })));
        assert.ok(close(fat, target), `fat ${fat} ≠ ${target}`);
      }),
    );
  });

  it('should refuse, or give no negative mass, whatever is on hand', () => {
    fc.assert(
      fc.property(
        blendOfMany,
        fc.integer({ min: 0, max: 1000 }),
        totalGrams,
        ({ fats, amounts, free }, target, total) => {
          const onHand = amounts
            .map((grams, i) => ({ key: `c${i}`, grams }))
            .filter((_, i) => !free.includes(i));
          const targetFat = dec(target).div(10);
          let result: CalcResult;
          try {
            result = calculateBlend(manyFormula(fats), { total, onHand, targetFat });
          } catch (error) {
            assert.ok(error instanceof BatchError, String(error));
            return;
          }
          const lines = meatGrams(result);
          assert.ok(sum(lines).equals(total));
          assert.ok(
            lines.every((g) => !g.isNegative()),
            lines.join(', '),
          );
          const fat = blendFatPercent(lines.map((grams, k) => ({ grams, fat: fats[k] })));
          assert.ok(close(fat, targetFat), `fat ${fat} ≠ ${targetFat}`);
        },
      ),
    );
  });
});

/** Three to five components: fats in tenths of a %, amounts of 1 g to 100 kg, two left free. */
const blendOfMany = fc.integer({ min: 3, max: 5 }).chain((n) =>
  fc.record({
    fats: fc.array(
      fc.integer({ min: 0, max: 1000 }).map((f) => dec(f).div(10)),
      { minLength: n, maxLength: n },
    ),
    amounts: fc.array(
      fc.integer({ min: 1, max: 100_000 }).map((g) => dec(g)),
      { minLength: n, maxLength: n },
    ),
    free: fc.uniqueArray(fc.integer({ min: 0, max: n - 1 }), { minLength: 2, maxLength: 2 }),
  }),
);

function manyFormula(fats: readonly Decimal[]): BlendFormula {
  return {
    formula: 1,
    id: 'prop-many',
    title: 'Property blend of many',
    kind: 'blend',
    components: fats.map((fat, i) => ({ key: `c${i}`, name: `trim ${i}`, fat: fat.toNumber() })),
    target: { fat: 20 },
  };
}
