import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { AppError } from '../../server/http/app-error.ts';
import { BELLY, BUN, readBatch, recordBatch } from '../helpers/batch-calls.ts';
import { startTestServer, type TestServer } from '../helpers/test-server.ts';

/** A belly cure Tobin recorded and put to cure, signed off by Imke. */
async function signedOffCure(server: TestServer): Promise<string> {
  const lot = await recordBatch(server.as('tobin'), BELLY);
  assert.equal(
    (await server.as('tobin').post(`/api/batches/${lot}/status`, { to: 'curing' })).status,
    200,
  );
  // Still curing, so the sign-off says what was checked (tests/api/batches-sign-off-note.spec.ts).
  const signed = await server
    .as('imke')
    .post(`/api/batches/${lot}/sign-off`, { note: 'Cure weights checked; curing in the walk-in.' });
  assert.equal(signed.status, 200, signed.text);
  return lot;
}

describe('separation of duties at sign-off', () => {
  it('should refuse the person who recorded a batch with 403, and let another sign it off', async (t) => {
    const server = await startTestServer(t);
    const rosa = server.as('rosa');
    const lot = await recordBatch(rosa, BUN);
    const own = await rosa.post(`/api/batches/${lot}/sign-off`, { note: 'Looks right to me' });
    assert.equal(own.status, 403, own.text);
    assert.equal(own.json.error.code, 'own-batch');
    assert.equal(own.json.error.message, 'you recorded this batch; another person signs it off');
    assert.equal((await readBatch(server, lot)).signedOff, null);
    const audit = await rosa.get('/api/audit?action=batch-sign-off');
    assert.equal(audit.json.events.filter((e: { subject: string }) => e.subject === lot).length, 0);
    const imke = await server.as('imke').post(`/api/batches/${lot}/sign-off`, {});
    assert.equal(imke.status, 200, imke.text);
  });

  it('should hold on the repository path the demo seed and the command line share', async (t) => {
    const server = await startTestServer(t);
    const lot = await recordBatch(server.as('rosa'), BUN);
    const rosa = await server.context.people.findByUsername('rosa');
    assert.ok(rosa);
    await assert.rejects(
      server.context.batches.signOff(lot, null, { actor: rosa }),
      (error: unknown) => error instanceof AppError && error.code === 'own-batch',
    );
  });

  it('should let the recorder sign off when LARDER_SEPARATE_SIGN_OFF is off', async (t) => {
    const server = await startTestServer(t, { LARDER_SEPARATE_SIGN_OFF: 'off' });
    const lot = await recordBatch(server.as('rosa'), BUN);
    const own = await server.as('rosa').post(`/api/batches/${lot}/sign-off`, {});
    assert.equal(own.status, 200, own.text);
  });
});

describe('a signed-off batch', () => {
  it('should refuse a cook and a reviewer moving or discarding it with 403, and leave it as it was', async (t) => {
    const server = await startTestServer(t);
    const lot = await signedOffCure(server);
    const before = await readBatch(server, lot);
    for (const [user, body, code] of [
      ['tobin', { to: 'done' }, 'signed-off'],
      ['tobin', { to: 'discarded', reason: 'Cooler failed overnight' }, 'signed-off'],
      ['imke', { to: 'done' }, 'forbidden'],
      ['imke', { to: 'discarded', reason: 'Cooler failed overnight' }, 'forbidden'],
    ] as const) {
      const response = await server.as(user).post(`/api/batches/${lot}/status`, body);
      assert.equal(response.status, 403, `${user} ${JSON.stringify(body)}: ${response.text}`);
      assert.equal(response.json.error.code, code);
    }
    const tobin = await server.as('tobin').post(`/api/batches/${lot}/status`, { to: 'done' });
    assert.match(tobin.json.error.message, /signed off; only an admin can change its status/);
    assert.deepEqual(await readBatch(server, lot), before);
  });

  it('should ask an admin for a reason with 400, then move it with the reason on its event and in the audit log', async (t) => {
    const server = await startTestServer(t);
    const lot = await signedOffCure(server);
    const rosa = server.as('rosa');
    const bare = await rosa.post(`/api/batches/${lot}/status`, { to: 'done' });
    assert.equal(bare.status, 400, bare.text);
    assert.equal(bare.json.error.code, 'reason-needed');
    assert.equal((await readBatch(server, lot)).status, 'curing');

    const reason = 'Probe read 71 °C at the core; the reviewer saw the log before it finished.';
    const moved = await rosa.post(`/api/batches/${lot}/status`, { to: 'done', reason });
    assert.equal(moved.status, 200, moved.text);
    const batch = await readBatch(server, lot);
    assert.equal(batch.status, 'done');
    assert.deepEqual(batch.events.at(-1), {
      ...batch.events.at(-1),
      type: 'status',
      from: 'curing',
      to: 'done',
      reason,
    });
    const audit = await rosa.get('/api/audit?action=batch-status');
    const entry = (
      audit.json.events as { subject: string; actorName: string; detail: object }[]
    ).find((e) => e.subject === lot);
    assert.equal(entry?.actorName, 'rosa');
    assert.deepEqual(entry?.detail, { from: 'curing', to: 'done', reason, afterSignOff: true });
  });

  it('should let an admin discard it with a reason', async (t) => {
    const server = await startTestServer(t);
    const lot = await signedOffCure(server);
    const reason = 'Bag found split at the flip; the reviewer had signed the sheet the day before.';
    const response = await server
      .as('rosa')
      .post(`/api/batches/${lot}/status`, { to: 'discarded', reason });
    assert.equal(response.status, 200, response.text);
    assert.equal(response.json.batch.status, 'discarded');
    assert.equal(response.json.batch.discardReason, reason);
  });

  it('should move on as any unsigned batch when LARDER_LOCK_SIGNED_OFF is off', async (t) => {
    const server = await startTestServer(t, { LARDER_LOCK_SIGNED_OFF: 'off' });
    const lot = await signedOffCure(server);
    const response = await server.as('tobin').post(`/api/batches/${lot}/status`, { to: 'done' });
    assert.equal(response.status, 200, response.text);
  });
});

describe('a cure reaching done', () => {
  it('should refuse a cure going from in progress straight to done with 409 and the reason', async (t) => {
    const server = await startTestServer(t);
    const tobin = server.as('tobin');
    const lot = await recordBatch(tobin, BELLY);
    const straight = await tobin.post(`/api/batches/${lot}/status`, { to: 'done' });
    assert.equal(straight.status, 409, straight.text);
    assert.equal(straight.json.error.code, 'not-cured');
    assert.equal(
      straight.json.error.message,
      'a cure is done only after curing; start curing first',
    );
    assert.equal((await readBatch(server, lot)).status, 'in-progress');
    assert.equal((await tobin.post(`/api/batches/${lot}/status`, { to: 'curing' })).status, 200);
    assert.equal((await tobin.post(`/api/batches/${lot}/status`, { to: 'done' })).status, 200);
    // Other kinds have no such step: a bun goes straight to done.
    const bun = await recordBatch(tobin, BUN);
    assert.equal((await tobin.post(`/api/batches/${bun}/status`, { to: 'done' })).status, 200);
  });

  it('should let a cure go straight to done when LARDER_CURE_BEFORE_DONE is off', async (t) => {
    const server = await startTestServer(t, { LARDER_CURE_BEFORE_DONE: 'off' });
    const lot = await recordBatch(server.as('tobin'), BELLY);
    const straight = await server.as('tobin').post(`/api/batches/${lot}/status`, { to: 'done' });
    assert.equal(straight.status, 200, straight.text);
  });
});

describe('the rules as the console reads them', () => {
  it('should send the rules in force with a batch', async (t) => {
    const server = await startTestServer(t, { LARDER_LOCK_SIGNED_OFF: 'off' });
    const lot = await recordBatch(server.as('tobin'), BUN);
    const response = await server.as('imke').get(`/api/batches/${lot}`);
    assert.deepEqual(response.json.rules, {
      separateSignOff: true,
      lockSignedOff: false,
      cureBeforeDone: true,
    });
  });
});

describe('the demo history under the rules', () => {
  it('should have every signed-off batch signed by someone who did not record it, and every done cure cured first', async (t) => {
    const server = await startTestServer(t);
    const page = await server.as('rosa').get('/api/batches?limit=200');
    const items = page.json.items as {
      lotCode: string;
      kind: string;
      status: string;
      operator: { id: number };
      signedOff: { by: { id: number } } | null;
    }[];
    const signed = items.filter((b) => b.signedOff);
    assert.ok(signed.length > 5, 'the demo has signed-off batches');
    for (const batch of signed)
      assert.notEqual(batch.signedOff?.by.id, batch.operator.id, batch.lotCode);
    const doneCures = items.filter((b) => b.kind === 'cure' && b.status === 'done');
    assert.ok(doneCures.length > 5, 'the demo has done cures');
    for (const { lotCode } of doneCures) {
      const { events } = await readBatch(server, lotCode);
      assert.ok(
        events.some((e) => e.from === 'in-progress' && e.to === 'curing'),
        `${lotCode} cured before it was done`,
      );
    }
  });
});
