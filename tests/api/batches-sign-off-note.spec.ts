import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { BELLY, readBatch, recordBatch } from '../helpers/batch-calls.ts';
import { startTestServer } from '../helpers/test-server.ts';

// The demo burger grind (formulas/chuck-grind.yaml) is held to the ground beef standard: at most
// 30 % fat. source: 9 CFR 319.15(a). Blended to 35 % it fails that check, which is a labelling
// rule and not critical, so the batch is recorded with a failed check.
const FATTY_GRIND = {
  formula: 'chuck-grind',
  batch: { total: '10 kg', targetFat: '35', start: new Date().toISOString().slice(0, 10) },
} as const;

describe('a sign-off that needs a note', () => {
  it('should refuse to sign off a batch with a failed check without a note naming it', async (t) => {
    const server = await startTestServer(t);
    const lot = await recordBatch(server.as('tobin'), FATTY_GRIND);
    const recorded = await server.as('rosa').get(`/api/batches/${lot}`);
    assert.equal(recorded.json.batch.checksPassed, false, recorded.text);

    const imke = await server.signIn('imke');
    for (const body of [{}, { note: '   ' }]) {
      const bare = await imke.post(`/api/batches/${lot}/sign-off`, body);
      assert.equal(bare.status, 400, bare.text);
      assert.equal(bare.json.error.code, 'note-needed');
      assert.match(bare.json.error.message, /the check “Fat” failed; say in the note/);
      assert.equal(bare.json.error.details[0].field, 'note');
    }
    assert.equal((await readBatch(server, lot)).signedOff, null);

    const note = 'Fat over the ground beef standard: labelled and sold as hamburger patties.';
    const signed = await imke.post(`/api/batches/${lot}/sign-off`, { note });
    assert.equal(signed.status, 200, signed.text);
    assert.equal((await readBatch(server, lot)).events.at(-1)?.reason, note);
  });

  it('should refuse to sign off a cure still curing without a note, and take one after curing', async (t) => {
    const server = await startTestServer(t);
    const tobin = server.as('tobin');
    const curing = await recordBatch(tobin, BELLY);
    await tobin.post(`/api/batches/${curing}/status`, { to: 'curing' });
    const imke = await server.signIn('imke');
    const bare = await imke.post(`/api/batches/${curing}/sign-off`, {});
    assert.equal(bare.status, 400, bare.text);
    assert.equal(bare.json.error.code, 'note-needed');
    assert.match(bare.json.error.message, /it is still curing/);
    const noted = await imke.post(`/api/batches/${curing}/sign-off`, {
      note: 'Cure weights checked; the belly stays in the walk-in until its ready date.',
    });
    assert.equal(noted.status, 200, noted.text);

    const cured = await recordBatch(tobin, BELLY);
    await tobin.post(`/api/batches/${cured}/status`, { to: 'curing' });
    await tobin.post(`/api/batches/${cured}/status`, { to: 'done' });
    const plain = await imke.post(`/api/batches/${cured}/sign-off`, {});
    assert.equal(plain.status, 200, plain.text);
  });
});
