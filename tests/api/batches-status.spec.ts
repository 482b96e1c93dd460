import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { BELLY, BUN, readBatch, recordBatch } from '../helpers/batch-calls.ts';
import { startTestServer } from '../helpers/test-server.ts';

describe('moving a batch along', () => {
  it('should take a cure from planned to done, appending an event and an audit entry each time', async (t) => {
    const server = await startTestServer(t);
    const tobin = await server.signIn('tobin');
    const lot = await recordBatch(tobin, { ...BELLY, status: 'planned' });
    let updatedAt = (await readBatch(server, lot)).updatedAt;
    for (const to of ['in-progress', 'curing', 'done']) {
      const response = await tobin.post(`/api/batches/${lot}/status`, { to });
      assert.equal(response.status, 200, response.text);
      assert.equal(response.json.batch.status, to);
      assert.ok(response.json.batch.updatedAt >= updatedAt);
      updatedAt = response.json.batch.updatedAt;
    }
    const batch = await readBatch(server, lot);
    assert.deepEqual(
      batch.events.map((e) => [e.type, e.from, e.to, e.by.displayName]),
      [
        ['recorded', null, 'planned', 'Tobin Marrowfeld (cook)'],
        ['status', 'planned', 'in-progress', 'Tobin Marrowfeld (cook)'],
        ['status', 'in-progress', 'curing', 'Tobin Marrowfeld (cook)'],
        ['status', 'curing', 'done', 'Tobin Marrowfeld (cook)'],
      ],
    );
    const audit = await server.as('rosa').get('/api/audit?action=batch-status');
    const mine = (audit.json.events as { subject: string; detail: { to: string } }[]).filter(
      (e) => e.subject === lot,
    );
    assert.deepEqual(
      mine.map((e) => e.detail.to),
      ['done', 'curing', 'in-progress'],
    );
  });

  it('should let doughs proof and cures cure, not the other way round', async (t) => {
    const server = await startTestServer(t);
    const rosa = server.as('rosa');
    const bun = await recordBatch(rosa, BUN);
    const belly = await recordBatch(rosa, BELLY);
    const curingBun = await rosa.post(`/api/batches/${bun}/status`, { to: 'curing' });
    assert.equal(curingBun.status, 409, curingBun.text);
    assert.equal(curingBun.json.error.code, 'bad-transition');
    const proofingBelly = await rosa.post(`/api/batches/${belly}/status`, { to: 'proofing' });
    assert.equal(proofingBelly.status, 409, proofingBelly.text);
    assert.equal((await rosa.post(`/api/batches/${bun}/status`, { to: 'proofing' })).status, 200);
    assert.equal((await rosa.post(`/api/batches/${bun}/status`, { to: 'done' })).status, 200);
    // A cure reaches done through curing (tests/api/batches-workflow-rules.spec.ts).
    assert.equal((await rosa.post(`/api/batches/${belly}/status`, { to: 'curing' })).status, 200);
    assert.equal((await rosa.post(`/api/batches/${belly}/status`, { to: 'done' })).status, 200);
  });

  it('should refuse the moves the workflow does not allow and leave the batch as it was', async (t) => {
    const server = await startTestServer(t);
    const tobin = await server.signIn('tobin');
    const planned = await recordBatch(tobin, { ...BELLY, status: 'planned' });
    const done = await recordBatch(tobin, BELLY);
    await tobin.post(`/api/batches/${done}/status`, { to: 'curing' });
    await tobin.post(`/api/batches/${done}/status`, { to: 'done' });
    const discarded = await recordBatch(tobin, BELLY);
    await tobin.post(`/api/batches/${discarded}/status`, { to: 'discarded', reason: 'dropped' });
    const refusals: [string, object, number, string][] = [
      [planned, { to: 'done' }, 409, 'bad-transition'],
      [planned, { to: 'curing' }, 409, 'bad-transition'],
      [planned, { to: 'planned' }, 409, 'bad-transition'],
      [done, { to: 'discarded', reason: 'changed our mind' }, 409, 'bad-transition'],
      [done, { to: 'in-progress' }, 409, 'bad-transition'],
      [discarded, { to: 'in-progress' }, 409, 'bad-transition'],
      [planned, { to: 'cooking' }, 400, 'bad-request'],
      [planned, {}, 400, 'bad-request'],
      [planned, { to: 'in-progress', why: 'x' }, 400, 'bad-request'],
      [planned, { to: 'in-progress', reason: 7 }, 400, 'bad-request'],
      ['240229-QB-99', { to: 'in-progress' }, 404, 'not-found'],
    ];
    const before = await Promise.all(
      [planned, done, discarded].map((lot) => readBatch(server, lot)),
    );
    for (const [lot, body, status, code] of refusals) {
      const response = await tobin.post(`/api/batches/${lot}/status`, body);
      assert.equal(response.status, status, `${lot} ${JSON.stringify(body)}: ${response.text}`);
      assert.equal(response.json.error.code, code, JSON.stringify(body));
    }
    const afterwards = await Promise.all(
      [planned, done, discarded].map((lot) => readBatch(server, lot)),
    );
    assert.deepEqual(afterwards, before);
    const reviewer = await server.as('imke').post(`/api/batches/${planned}/status`, {
      to: 'in-progress',
    });
    assert.equal(reviewer.status, 403);
  });

  it('should need a reason to discard a batch, and keep it', async (t) => {
    const server = await startTestServer(t);
    const tobin = server.as('tobin');
    const lot = await recordBatch(tobin, BELLY);
    for (const body of [{ to: 'discarded' }, { to: 'discarded', reason: '   ' }]) {
      const response = await tobin.post(`/api/batches/${lot}/status`, body);
      assert.equal(response.status, 400, response.text);
    }
    assert.equal((await readBatch(server, lot)).status, 'in-progress');
    const reason = 'Vacuum bag split in the walk-in; the belly sat in its own brine, unbagged.';
    const response = await tobin.post(`/api/batches/${lot}/status`, { to: 'discarded', reason });
    assert.equal(response.status, 200, response.text);
    const batch = await readBatch(server, lot);
    assert.equal(batch.status, 'discarded');
    assert.equal(batch.discardReason, reason);
    assert.equal(batch.events.at(-1)?.reason, reason);
  });
});

describe('signing a batch off', () => {
  it('should let a reviewer sign off once, and refuse a second sign-off and a cook', async (t) => {
    const server = await startTestServer(t);
    const lot = await recordBatch(server.as('tobin'), BELLY);
    await server.as('tobin').post(`/api/batches/${lot}/status`, { to: 'curing' });
    const cook = await server.as('tobin').post(`/api/batches/${lot}/sign-off`, {});
    assert.equal(cook.status, 403, cook.text);
    assert.equal(cook.json.error.code, 'forbidden');

    const imke = await server.signIn('imke');
    const signed = await imke.post(`/api/batches/${lot}/sign-off`, {
      note: 'Cure weights checked against the scale print-out.',
    });
    assert.equal(signed.status, 200, signed.text);
    assert.equal(signed.json.batch.signedOff.by.displayName, 'Imke Tressaly (food safety)');
    const batch = await readBatch(server, lot);
    assert.deepEqual(
      { ...batch.events.at(-1), at: undefined },
      {
        type: 'sign-off',
        at: undefined,
        by: signed.json.batch.signedOff.by,
        from: null,
        to: null,
        reason: 'Cure weights checked against the scale print-out.',
      },
    );
    const audit = await server.as('rosa').get('/api/audit?action=batch-sign-off');
    assert.equal(audit.json.events[0].subject, lot);
    assert.equal(audit.json.events[0].actorName, 'imke');

    const again = await server.as('rosa').post(`/api/batches/${lot}/sign-off`, {});
    assert.equal(again.status, 409, again.text);
    assert.equal(again.json.error.code, 'already-signed-off');
    assert.deepEqual((await readBatch(server, lot)).signedOff, batch.signedOff);
  });

  it('should let an admin sign off without a body, and refuse planned and discarded batches', async (t) => {
    const server = await startTestServer(t);
    const rosa = server.as('rosa');
    // Recorded by a cook: nobody signs off a batch they recorded themselves.
    const tobin = server.as('tobin');
    const done = await recordBatch(tobin, BUN);
    await tobin.post(`/api/batches/${done}/status`, { to: 'done' });
    const bare = await rosa.request('POST', `/api/batches/${done}/sign-off`);
    assert.equal(bare.status, 200, bare.text);
    const planned = await recordBatch(tobin, { ...BUN, status: 'planned' });
    const discarded = await recordBatch(tobin, BUN);
    await tobin.post(`/api/batches/${discarded}/status`, {
      to: 'discarded',
      reason: 'overproofed',
    });
    for (const lot of [planned, discarded]) {
      const response = await rosa.post(`/api/batches/${lot}/sign-off`, {});
      assert.equal(response.status, 409, response.text);
      assert.equal(response.json.error.code, 'not-signable');
      assert.equal((await readBatch(server, lot)).signedOff, null);
    }
    const bad = await rosa.post(`/api/batches/${done}/sign-off`, { note: 'x'.repeat(501) });
    assert.equal(bad.status, 400);
    assert.equal((await rosa.post('/api/batches/240229-PB-99/sign-off', {})).status, 404);
  });
});
