import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import {
  RECHILLED,
  at,
  cleanRun,
  move,
  processOf,
  reading,
  recordControlled,
  startProcessServer,
} from '../helpers/process-calls.ts';

describe('hold and release', () => {
  it('should hold a batch with an open deviation from done and verification until its corrective action', async (t) => {
    const { server, clock } = await startProcessServer(t);
    const tobin = await server.signIn('tobin');
    const imke = await server.signIn('imke');
    const lot = await recordControlled(tobin);
    await cleanRun(tobin, lot, clock);
    // source: FDA Food Code 2022 §3-501.16(A)(2): 46 °F is over 41 °F
    clock.set(new Date(at(420)));
    const warm = await reading(tobin, lot, 'hold', '46 °F', at(400));
    await move(tobin, lot, 'curing');
    const held = await tobin.post(`/api/batches/${lot}/status`, { to: 'done' });
    assert.equal(held.status, 409, held.text);
    assert.equal(held.json.error.code, 'on-hold');
    assert.match(held.json.error.message, /corrective action/);

    const id = warm.deviation.id as number;
    const half = await tobin.post(`/api/deviations/${id}/action`, { ...RECHILLED, cause: '  ' });
    assert.equal(half.status, 422, half.text);
    assert.equal(half.json.error.details[0].field, 'cause');
    const noAmount = await tobin.post(`/api/deviations/${id}/action`, {
      ...RECHILLED,
      disposition: 'discarded',
    });
    assert.equal(noAmount.status, 422, noAmount.text);
    assert.equal(noAmount.json.error.details[0].field, 'grams');
    const action = await tobin.post(`/api/deviations/${id}/action`, RECHILLED);
    assert.equal(action.status, 201, action.text);
    assert.equal(action.json.deviation.action.disposition, 'rechilled');
    assert.equal(action.json.deviation.action.cause, RECHILLED.cause);

    // A second action replaces the first only with a reason; the first stays as an earlier one.
    const unexplained = await tobin.post(`/api/deviations/${id}/action`, {
      ...RECHILLED,
      disposition: 'discarded',
      grams: '1.2 kg',
    });
    assert.equal(unexplained.status, 422, unexplained.text);
    assert.equal(unexplained.json.error.code, 'reason-needed');
    const replaced = await tobin.post(`/api/deviations/${id}/action`, {
      ...RECHILLED,
      disposition: 'discarded',
      grams: '1.2 kg',
      reason: 'The probe showed the centre stayed warm; the piece was thrown out.',
    });
    assert.equal(replaced.status, 201, replaced.text);
    assert.equal(replaced.json.deviation.action.disposition, 'discarded');
    assert.equal(replaced.json.deviation.action.dispositionGrams, '1200');
    assert.deepEqual(
      replaced.json.deviation.earlierActions.map((a: { disposition: string }) => a.disposition),
      ['rechilled'],
    );

    await move(tobin, lot, 'done');
    const own = await server.as('tobin').post(`/api/batches/${lot}/verify`, {});
    assert.equal(own.status, 403, own.text);
    const verified = await imke.post(`/api/batches/${lot}/verify`, { note: 'Logs reviewed.' });
    assert.equal(verified.status, 201, verified.text);
    assert.equal(verified.json.verification.note, 'Logs reviewed.');
    const record = await processOf(server, lot);
    assert.equal(record.onHold, false);
    assert.equal(record.nonconforming, true);
    assert.equal(record.verification!.by!.displayName, 'Imke Tressaly (food safety)');
    const events = (await server.as('rosa').get(`/api/batches/${lot}`)).json.batch.events;
    assert.match(events.at(-1).reason, /^Records verified; released/);
    const again = await imke.post(`/api/batches/${lot}/verify`, {});
    assert.equal(again.status, 409, again.text);
  });

  it('should refuse verification before done, with a control not met, and of one’s own batch', async (t) => {
    const { server, clock } = await startProcessServer(t);
    const rosa = server.as('rosa');
    const imke = server.as('imke');
    const lot = await recordControlled(rosa);
    await reading(rosa, lot, 'smoker', '72 °C', at(0));
    await reading(rosa, lot, 'cook', '159 °F', at(1));
    const early = await imke.post(`/api/batches/${lot}/verify`, {});
    assert.equal(early.status, 409, early.text);
    assert.equal(early.json.error.code, 'not-finished');

    // Chilling and cold holding have no reading: done, but not every limit is shown met.
    clock.set(new Date(at(30)));
    await move(rosa, lot, 'curing', 'done');
    const open = await imke.post(`/api/batches/${lot}/verify`, {});
    assert.equal(open.status, 409, open.text);
    assert.equal(open.json.error.code, 'controls-open');
    assert.match(open.json.error.message, /Chilling after the smoke, Cold holding/);

    const own = await recordControlled(rosa);
    await cleanRun(rosa, own, clock);
    clock.set(new Date(at(400)));
    await move(rosa, own, 'curing', 'done');
    const mine = await rosa.post(`/api/batches/${own}/verify`, {});
    assert.equal(mine.status, 403, mine.text);
    assert.equal(mine.json.error.code, 'own-batch');
    const theirs = await imke.post(`/api/batches/${own}/verify`, {});
    assert.equal(theirs.status, 201, theirs.text);
    assert.equal((await processOf(server, own)).nonconforming, false);
  });

  it('should open the miss of a cook never reached when the batch is marked done, and hold it', async (t) => {
    const { server, clock } = await startProcessServer(t);
    const rosa = server.as('rosa');
    const lot = await recordControlled(rosa);
    // source: FSIS Appendix A (1999), 158 °F instant lethality: 150 °F does not reach it
    const cool = await reading(rosa, lot, 'cook', '150 °F', at(0));
    assert.equal(cool.state.status, 'in-progress');
    clock.set(new Date(at(30)));
    await move(rosa, lot, 'curing', 'done');
    const record = await processOf(server, lot);
    assert.deepEqual(
      record.deviations.map((d) => [d.control, d.kind]),
      [['cook', 'reading']],
    );
    assert.equal(record.onHold, true);
    const held = await server.as('imke').post(`/api/batches/${lot}/verify`, {});
    assert.equal(held.json.error.code, 'on-hold');
  });
});
