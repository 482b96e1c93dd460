import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../../shared/decimal.ts';
import { insertReceipts, lotsLeft } from '../helpers/lot-use-fixture.ts';
import { DAIRY_LOTS, dairyDelivery } from '../helpers/dairy-fixture.ts';
import { clearStock } from '../helpers/pull-list-fixture.ts';
import { clockFrom, startTestServer } from '../helpers/test-server.ts';

// A fixed day years before the demo's, which is seeded around the real today: none of this
// test's lot codes can meet one of the demo's.
const CLOCK = clockFrom('2020-12-03');

/** Grams of a line on a batch's sheet, every group's added up (a preferment's own left out). */
function sheetGrams(
  result: { groups: { title: string; lines: { name: string; grams: string }[] }[] },
  name: string,
): Decimal {
  return result.groups
    .filter((group) => !/\(reference\)\s*$/i.test(group.title))
    .flatMap((group) => group.lines)
    .filter((line) => line.name === name)
    .reduce((sum, line) => sum.plus(line.grams), new Decimal(0));
}

describe('a batch drawing on eggs counted and milk by the litre', () => {
  it('should suggest whole eggs and millilitres of milk from the batch’s grams, and take them off', async (t) => {
    const server = await startTestServer(t, {}, { now: CLOCK });
    const { db } = server.context;
    await clearStock(db);
    await insertReceipts(db, dairyDelivery('2020-12-01'));
    const made = await server.as('tobin').post('/api/batches', {
      formula: 'pit-bun',
      batch: { pieces: '24', start: '2020-12-03' },
    });
    assert.equal(made.status, 201, made.text);
    const lot = made.json.batch.lotCode as string;
    const read = await server.as('tobin').get(`/api/batches/${lot}/lots`);
    assert.equal(read.status, 200, read.text);
    const item = (key: string) => read.json.suggested.find((s: { item: string }) => s.item === key);

    // by hand: the sheet's egg at 50 g a large egg (source: USDA FoodData Central, SR Legacy,
    // "Egg, whole, raw, fresh", 1 large = 50 g, from memory, as the demo catalogue gives it),
    // rounded up to whole eggs: a cracked egg is used whole
    const eggGrams = sheetGrams(made.json.batch.result, 'whole egg');
    const eggs = item('eggs');
    assert.equal(eggs.grams, eggGrams.toString());
    assert.equal(eggs.weighs, '50 g');
    assert.equal(eggs.need, eggGrams.div(50).ceil().toString());
    assert.deepEqual(
      eggs.takes.map((u: { lotCode: string; amount: string }) => [u.lotCode, u.amount]),
      [[DAIRY_LOTS.eggs, eggs.need]],
    );
    // by hand: the sheet's milk at 244 g a US cup of 3.785411784 L ÷ 16 = 236.5882365 ml
    // (source: the same, "Milk, whole, 3.25% milkfat, with added vitamin D", 1 cup = 244 g,
    // from memory; the cup: NIST SP 811 (2008), Appendix B.8)
    const milkGrams = sheetGrams(made.json.batch.result, 'whole milk');
    const milk = item('whole-milk');
    assert.equal(milk.measure, 'ml');
    assert.equal(milk.need, milkGrams.times('236.5882365').div(244).toString());

    const accept = await server.as('tobin').post(`/api/batches/${lot}/lots`, { accept: true });
    assert.equal(accept.status, 201, accept.text);
    const left = await lotsLeft(db);
    assert.equal(left[DAIRY_LOTS.eggs].remaining, new Decimal(30).minus(eggs.need).toString());
    assert.equal(left[DAIRY_LOTS.milk].remaining, new Decimal(6000).minus(milk.need).toString());
  });
});
