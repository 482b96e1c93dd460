import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import fc from 'fast-check';
import { Decimal, ZERO } from '../decimal.ts';
import { type TrimOnHand, leastCostBlend } from './least-cost-blend.ts';

/**
 * The cheapest blend by brute force: every pair of trims of different fat as the two free ones,
 * and every way of putting the others at none or all on hand. Exponential, so only for a few
 * trims; undefined when no vertex is within what is on hand.
 */
function bruteForceCost(
  trims: readonly TrimOnHand[],
  target: Decimal,
  batch: Decimal,
): Decimal | undefined {
  let best: Decimal | undefined;
  const n = trims.length;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      if (trims[i].fatPercent.equals(trims[j].fatPercent)) continue;
      const others = [...Array(n).keys()].filter((k) => k !== i && k !== j);
      for (let mask = 0; mask < 1 << others.length; mask++) {
        const grams = trims.map(() => ZERO);
        others.forEach((k, bit) => {
          if (mask & (1 << bit)) grams[k] = trims[k].availableGrams;
        });
        const rest = batch.minus(grams.reduce((a, b) => a.plus(b), ZERO));
        const restFat = target
          .times(batch)
          .minus(grams.reduce((a, g, k) => a.plus(g.times(trims[k].fatPercent)), ZERO));
        grams[i] = restFat
          .minus(trims[j].fatPercent.times(rest))
          .div(trims[i].fatPercent.minus(trims[j].fatPercent));
        grams[j] = rest.minus(grams[i]);
        const within = (k: number) =>
          !grams[k].lessThan(ZERO) && grams[k].lessThanOrEqualTo(trims[k].availableGrams);
        if (!within(i) || !within(j)) continue;
        const cost = grams.reduce(
          (a, g, k) => a.plus(g.times(trims[k].pricePerKg).div(1000)),
          ZERO,
        );
        if (best === undefined || cost.lessThan(best)) best = cost;
      }
    }
  }
  return best;
}

// Whole-number fats, prices and stock, so ties on the price line (equal prices, collinear trims)
// come up often: the cases the tie-breaking rule is there for.
const trimArb = fc.record({
  fat: fc.integer({ min: 5, max: 60 }),
  price: fc.integer({ min: 1, max: 6 }),
  kg: fc.integer({ min: 0, max: 60 }),
});

describe('leastCostBlend property', () => {
  // derived: an optimal vertex of a bounded linear program is among all its vertices
  it('should cost what the cheapest vertex costs, found by trying every vertex', () => {
    fc.assert(
      fc.property(
        fc.array(trimArb, { minLength: 2, maxLength: 6 }),
        fc.integer({ min: 5, max: 60 }),
        fc.integer({ min: 1, max: 150 }),
        (raw, targetFat, batchKg) => {
          const trims: TrimOnHand[] = raw.map((t, k) => ({
            name: `trim ${k}`,
            fatPercent: new Decimal(t.fat),
            pricePerKg: new Decimal(t.price),
            availableGrams: new Decimal(t.kg * 1000),
          }));
          const target = new Decimal(targetFat);
          const batch = new Decimal(batchKg * 1000);
          const usable = trims.filter((t) => t.availableGrams.greaterThan(0));
          const expected =
            usable.length > 0 && usable.every((t) => t.fatPercent.equals(target))
              ? undefined // one fat only: no vertex pair; checked apart below
              : bruteForceCost(usable, target, batch);
          const blend = leastCostBlend({ trims, targetFatPercent: target, batchGrams: batch });
          if (usable.every((t) => t.fatPercent.equals(target)) && usable.length > 0) return;
          if (expected === undefined) {
            assert.equal(blend.ok, false);
            return;
          }
          assert.ok(blend.ok, blend.ok ? '' : blend.message);
          assert.equal(
            blend.cost.toDecimalPlaces(20).toString(),
            expected.toDecimalPlaces(20).toString(),
          );
          const mass = blend.shares.reduce((a, s) => a.plus(s.grams), ZERO);
          assert.ok(mass.equals(batch));
          const fat = blend.shares.reduce((a, s) => a.plus(s.grams.times(s.trim.fatPercent)), ZERO);
          assert.equal(fat.div(batch).toDecimalPlaces(20).toString(), target.toString());
          for (const share of blend.shares)
            assert.ok(share.grams.lessThanOrEqualTo(share.trim.availableGrams));
        },
      ),
      { numRuns: 400 },
    );
  });

  // derived: trims all at the target fat make any mix at it, so the cheapest go first
  it('should take the cheapest first when every trim has the target fat', () => {
    const blend = leastCostBlend({
      trims: [
        {
          name: 'a',
          fatPercent: new Decimal(20),
          pricePerKg: new Decimal(5),
          availableGrams: new Decimal(30000),
        },
        {
          name: 'b',
          fatPercent: new Decimal(20),
          pricePerKg: new Decimal(3),
          availableGrams: new Decimal(30000),
        },
      ],
      targetFatPercent: new Decimal(20),
      batchGrams: new Decimal(40000),
    });
    assert.ok(blend.ok);
    assert.deepEqual(
      blend.shares.map((s) => `${s.trim.name}: ${s.grams.toString()}`),
      ['a: 10000', 'b: 30000'],
    );
  });
});
