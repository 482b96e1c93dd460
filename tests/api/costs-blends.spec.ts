import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { send, suiteServer } from '../helpers/api-calls.ts';
import { addReceipt, dayFromToday } from '../helpers/cost-fixture.ts';
import { clearStock } from '../helpers/pull-list-fixture.ts';

/** The trims of the hand-solved case in shared/costing/least-cost-blend.spec.ts. */
const TRIMS = [
  { name: '90/10 lean', fat: 10, price: 6, onHand: '60 kg' },
  { name: '80/20 chuck', fat: 20, price: 4.5, onHand: '50 kg' },
  { name: '50/50 trim', fat: 50, price: 2, onHand: '40 kg' },
];

describe('POST /api/blends/least-cost', () => {
  const server = suiteServer();

  // Hand working (least-cost-blend.spec.ts): 100 kg at 25 % fat; with all 50 kg of chuck the other
  // 50 kg must be 30 %: lean 50 × (50 − 30) ÷ 40 = 25 kg and 25 kg of 50/50; cost 25 × 6 + 50 ×
  // 4.5 + 25 × 2 = 425.00, 4.25 a kg, cheaper than every other pair at a bound. (derived: the
  // mass and fat balances of a linear blend)
  it('should answer the hand-solved case: 25 kg lean, 50 kg chuck, 25 kg 50/50 at 4.25 a kg', async () => {
    const response = await send(server(), 'imke', {
      method: 'POST',
      path: '/api/blends/least-cost',
      body: { target: 25, batch: '100 kg', standard: 'ground-beef', trims: TRIMS },
    });
    assert.equal(response.status, 200, response.text);
    const shares = response.json.shares.map(
      (share: { name: string; grams: string }) => `${share.name}: ${share.grams}`,
    );
    assert.deepEqual(shares, ['90/10 lean: 25000', '80/20 chuck: 50000', '50/50 trim: 25000']);
    assert.equal(response.json.costText, '425.00');
    assert.equal(response.json.costPerKgText, '4.25');
    assert.match(response.json.standard, /ground beef, 9 CFR 319\.15\(a\): at most 30/);
  });

  // source: 9 CFR 319.15(a), ground beef at most 30 % fat (as quoted in
  // shared/reference/fat-standards.ts): 35 % is refused, with the reason in words.
  it('should refuse a target above the standard with the reason', async () => {
    const response = await send(server(), 'rosa', {
      method: 'POST',
      path: '/api/blends/least-cost',
      body: { target: 35, batch: '100 kg', standard: 'ground-beef', trims: TRIMS },
    });
    assert.equal(response.status, 422, response.text);
    assert.equal(response.json.error.code, 'blend-refused');
    assert.equal(response.json.error.details[0].reason, 'above-standard');
    assert.match(response.json.error.message, /35(\.00)? % fat is above the 30(\.00)? %/);
  });

  // 60 + 50 + 40 = 150 kg on hand; 200 kg cannot be made.
  it('should refuse a batch bigger than the trims on hand', async () => {
    const response = await send(server(), 'rosa', {
      method: 'POST',
      path: '/api/blends/least-cost',
      body: { target: 20, batch: '200 kg', trims: TRIMS },
    });
    assert.equal(response.status, 422);
    assert.equal(response.json.error.details[0].reason, 'not-enough-stock');
    assert.match(response.json.error.message, /150 kg; the batch needs 200 kg/);
  });

  it('should not let a cook see prices', async () => {
    const response = await send(server(), 'tobin', {
      method: 'POST',
      path: '/api/blends/least-cost',
      body: { target: 20, batch: '10 kg', trims: TRIMS },
    });
    assert.equal(response.status, 403);
  });

  // From stock: lean trim 90/10 (10 % fat) 20 kg at 8.00 a kg, 50/50 trim 10 kg at 2.50 (the older
  // 50/50 delivery at 3.10 is used up, the latest price is 2.50). 10 kg at 20 % fat: the Pearson
  // square, parts 50 − 20 = 30 and 20 − 10 = 10, so 7.5 kg lean and 2.5 kg 50/50 (source: the
  // Pearson square, "Meat Calculations" training presentation for meat-evaluation contests,
  // issuer not identified, https://slideplayer.com./slide/7660647, own example). Cost 7.5 × 8 +
  // 2.5 × 2.5 = 66.25, 6.625 a kg → 6.63 (half-up).
  it('should blend the trims on hand at their latest prices: the two-trim Pearson answer', async () => {
    // From a kitchen that has received nothing: the demo's trims would join the blend.
    await clearStock(server().context.db);
    await addReceipt(server(), {
      item: 'beef-lean-trim',
      itemName: 'beef',
      quantity: '20',
      unit: 'kg',
      amount: '20000',
      unitCost: '8.00',
      on: dayFromToday(-2),
    });
    await addReceipt(server(), {
      item: 'beef-fat-trim',
      itemName: 'beef fat',
      quantity: '10',
      unit: 'kg',
      amount: '10000',
      unitCost: '3.10',
      on: dayFromToday(-9),
      emptiedOn: dayFromToday(-3),
    });
    await addReceipt(server(), {
      item: 'beef-fat-trim',
      itemName: 'beef fat',
      quantity: '22.0462262',
      unit: 'lb',
      amount: '10000',
      unitCost: '1.133980925',
      on: dayFromToday(-1),
    });
    const trims = await send(server(), 'rosa', { method: 'GET', path: '/api/blends/trims' });
    assert.equal(trims.status, 200, trims.text);
    // 1.133980925 a lb × 1000 ÷ 453.59237 = 2.50 a kg
    assert.deepEqual(
      trims.json.trims.map(
        (t: { item: string; fat: string; pricePerKg: string; onHandGrams: string }) => [
          t.item,
          t.fat,
          t.pricePerKg,
          t.onHandGrams,
        ],
      ),
      [
        ['beef-fat-trim', '50', '2.5', '10000'],
        ['beef-lean-trim', '10', '8', '20000'],
      ],
    );
    const response = await send(server(), 'rosa', {
      method: 'POST',
      path: '/api/blends/least-cost',
      body: { target: 20, batch: '10 kg', standard: 'ground-beef' },
    });
    assert.equal(response.status, 200, response.text);
    const shares = response.json.shares.map(
      (s: { name: string; grams: string }) => `${s.name}: ${s.grams}`,
    );
    assert.deepEqual(shares, ['brisket fat trim 50/50: 2500', 'lean trim 90/10: 7500']);
    assert.equal(response.json.cost, '66.25');
    assert.equal(response.json.costPerKgText, '6.63');
  });
});
