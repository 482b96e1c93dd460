import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { recordAssembly } from '../helpers/lot-use-fixture.ts';
import { clockFrom, startTestServer, type TestServer } from '../helpers/test-server.ts';

const BURGER = { id: 'smokehouse-burger', title: 'Smokehouse burger' };

/** A server whose today can be moved: noon of `clock.day`. */
async function movableServer(t: Parameters<typeof startTestServer>[0]) {
  const clock = { day: '2027-03-01' };
  const server = await startTestServer(t, {}, { now: () => clockFrom(clock.day)() });
  return { server, clock };
}

/** A sauce batch started on the clock's day; its lot code. */
async function sauce(server: TestServer): Promise<string> {
  const response = await server.as('tobin').post('/api/batches', {
    formula: 'house-sauce',
    batch: { total: '2 kg' },
  });
  assert.equal(response.status, 201, response.text);
  return response.json.batch.lotCode as string;
}

/** A burger assembly batch started on the clock's day, as the lot-use tests insert one; its lot code. */
function burgersOn(server: TestServer, day: string): Promise<string> {
  return recordAssembly(server, BURGER.id, day);
}

async function markDone(server: TestServer, lot: string): Promise<void> {
  const moved = await server.as('tobin').post(`/api/batches/${lot}/status`, { to: 'done' });
  assert.equal(moved.status, 200, moved.text);
}

type OnHand = { lotCode: string; useBy: string | null; madeOn?: string | null };

describe('an assembly drawing on batches with a use-by', () => {
  it('should offer the sauce first to expire first, set the one past its use-by apart and refuse it', async (t) => {
    const { server, clock } = await movableServer(t);
    // The sauce is ready to eat and held cold (formulas/house-sauce.yaml): 7 days, the day it
    // was made (marked done) day 1. source: FDA Food Code 2022, 3-501.17(A)
    clock.day = '2027-03-01';
    const first = await sauce(server); // made Mon 1 Mar: use by Sun 7 Mar
    await markDone(server, first);
    clock.day = '2027-03-02';
    const slow = await sauce(server); // started Tue 2 Mar, made Thu 4 Mar: use by Wed 10 Mar
    clock.day = '2027-03-03';
    const quick = await sauce(server); // made Wed 3 Mar: use by Tue 9 Mar
    await markDone(server, quick);
    clock.day = '2027-03-04';
    await markDone(server, slow);

    clock.day = '2027-03-08';
    const burgers = await burgersOn(server, clock.day);
    const tobin = server.as('tobin');
    const read = await tobin.get(`/api/batches/${burgers}/lots`);
    assert.equal(read.status, 200, read.text);
    const part = read.json.suggested.find((s: { item: string }) => s.item === 'house-sauce');
    const mine = (lots: OnHand[]) =>
      lots
        .filter((lot) => [first, slow, quick].includes(lot.lotCode))
        .map((lot) => [lot.lotCode, lot.useBy, lot.madeOn]);
    // hand-worked on Mon 8 Mar: 1 Mar + 6 days = 7 Mar, past; 3 Mar → 9 Mar before 4 Mar → 10 Mar
    assert.deepEqual(mine(part.onHand), [
      [quick, '2027-03-09', '2027-03-03'],
      [slow, '2027-03-10', '2027-03-04'],
    ]);
    assert.deepEqual(mine(part.expired), [[first, '2027-03-07', '2027-03-01']]);

    const stale = await tobin.post(`/api/batches/${burgers}/lots`, {
      picks: [{ part: 'house-sauce', batch: first, amount: '500 g' }],
    });
    assert.equal(stale.status, 422, stale.text);
    assert.equal(stale.json.error.code, 'expired-source');
    assert.equal(
      stale.json.error.message,
      `batch ${first} was to be used by 7 Mar 2027, before this batch was started on 8 Mar 2027: discard it`,
    );
    const made = await tobin.post(`/api/batches/${burgers}/lots`, {
      picks: [{ part: 'house-sauce', batch: quick, amount: '500 g' }],
    });
    assert.equal(made.status, 201, made.text);
    assert.deepEqual(
      made.json.uses.map((u: { lotCode: string; useBy: string | null }) => [u.lotCode, u.useBy]),
      [[quick, '2027-03-09']],
    );
  });

  it('should give a batch its formula leaves undated no use-by, and say why', async (t) => {
    const { server, clock } = await movableServer(t);
    clock.day = '2027-03-01';
    const grind = await server.as('tobin').post('/api/batches', {
      formula: 'chuck-grind',
      batch: { want: '5 kg' },
    });
    assert.equal(grind.status, 201, grind.text);
    const lot = grind.json.batch.lotCode as string;
    await markDone(server, lot);
    clock.day = '2027-03-20';
    const burgers = await burgersOn(server, clock.day);
    const read = await server.as('tobin').get(`/api/batches/${burgers}/lots`);
    const part = read.json.suggested.find((s: { item: string }) => s.item === 'chuck-grind');
    const offered = part.onHand.find((b: OnHand) => b.lotCode === lot);
    // Raw patties, no validated shelf life (formulas/chuck-grind.yaml): the Food Code's date
    // marking is for ready-to-eat food (3-501.17(A)), so no day is made up.
    assert.equal(offered.useBy, null);
    assert.match(offered.noUseBy, /^not ready to eat/);
  });
});
