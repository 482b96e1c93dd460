import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import {
  at,
  processOf,
  reading,
  recordControlled,
  rowCount,
  startProcessServer,
} from '../helpers/process-calls.ts';

describe('readings at a batch’s controls', () => {
  it('should open a deviation for a reading out of limit, once, however often it is posted', async (t) => {
    const { server, clock } = await startProcessServer(t);
    const tobin = await server.signIn('tobin');
    const lot = await recordControlled(tobin);
    // The cook reached 160 °F, over 158 °F (FSIS Appendix A, 1999), so only holding can miss.
    await reading(tobin, lot, 'cook', '160 °F', at(0));
    // source: FDA Food Code 2022, §3-501.16(A)(2): cold holding at 41 °F or below; 45 °F is over
    const first = await reading(tobin, lot, 'hold', '45 °F', at(1));
    assert.equal(first.reading.enteredAs, '45 °F');
    assert.equal(first.reading.source, 'console');
    assert.equal(first.state.status, 'missed');
    assert.equal(first.deviation.kind, 'reading');
    assert.equal(first.deviation.control, 'hold');
    assert.match(first.deviation.what, /^Cold holding: /);
    assert.equal(first.deviation.action, null);

    const again = await reading(tobin, lot, 'hold', '45 °F', at(1));
    assert.equal(again.deviation, null);
    const record = await processOf(server, lot);
    assert.equal(record.deviations.length, 1);
    assert.equal(record.onHold, true);
    assert.equal(record.nonconforming, true);
    assert.equal(record.controls.find((c) => c.control.id === 'hold')!.readings.length, 2);

    // Within the limit: 38 °F is below 41 °F; nothing more opens.
    clock.set(new Date(at(240)));
    const cold = await reading(tobin, lot, 'hold', '38 °F');
    assert.equal(cold.deviation, null);
    assert.equal(await rowCount(server, 'deviations'), 1);
    const audit = await server.as('rosa').get('/api/audit?action=deviation-open');
    assert.equal(audit.json.events.filter((e: { subject: string }) => e.subject === lot).length, 1);
  });

  it('should keep a corrected reading beside its correction, and audit both values', async (t) => {
    const { server } = await startProcessServer(t);
    const tobin = await server.signIn('tobin');
    const lot = await recordControlled(tobin);
    const typo = await reading(tobin, lot, 'smoker', '17 °C', at(0));
    // source: the fixture's own chamber limit, 60–80 °C: 17 °C is a miss
    assert.ok(typo.deviation);
    const corrected = await tobin.post(`/api/readings/${typo.reading.id}/correction`, {
      value: '71 °C',
      reason: 'Typed 17 for 71.',
    });
    assert.equal(corrected.status, 201, corrected.text);
    assert.equal(corrected.json.reading.corrects, typo.reading.id);
    assert.equal(corrected.json.reading.at, at(0));
    assert.equal(corrected.json.reading.reason, 'Typed 17 for 71.');

    const smoker = (await processOf(server, lot)).controls.find((c) => c.control.id === 'smoker')!;
    assert.deepEqual(
      smoker.readings.map((r) => [r.value, r.correctedBy, r.corrects]),
      [
        ['17', corrected.json.reading.id, null],
        ['71', null, typo.reading.id],
      ],
    );
    const audit = await server.as('rosa').get('/api/audit?action=reading-correct');
    const [event] = audit.json.events;
    assert.equal(event.subject, lot);
    assert.deepEqual(
      [event.detail.from.value, event.detail.to.value, event.detail.reason],
      ['17', '71', 'Typed 17 for 71.'],
    );

    const twice = await tobin.post(`/api/readings/${typo.reading.id}/correction`, {
      value: '72 °C',
      reason: 'again',
    });
    assert.equal(twice.status, 409, twice.text);
    assert.equal(twice.json.error.code, 'already-corrected');
    const ofCorrection = await tobin.post(`/api/readings/${corrected.json.reading.id}/correction`, {
      value: '72 °C',
      reason: 'The probe settled at 72.',
    });
    assert.equal(ofCorrection.status, 201, ofCorrection.text);
    const noReason = await tobin.post(`/api/readings/${ofCorrection.json.reading.id}/correction`, {
      value: '72 °C',
      reason: '   ',
    });
    assert.equal(noReason.status, 422, noReason.text);
    assert.equal(noReason.json.error.details[0].field, 'reason');
  });

  it('should refuse readings it cannot take, with words and the field at fault, storing nothing', async (t) => {
    const { server } = await startProcessServer(t);
    const rosa = server.as('rosa');
    const planned = await recordControlled(rosa, 'planned');
    const discarded = await recordControlled(rosa);
    const moved = await rosa.post(`/api/batches/${discarded}/status`, {
      to: 'discarded',
      reason: 'Dropped on the floor.',
    });
    assert.equal(moved.status, 200, moved.text);
    const lot = await recordControlled(rosa);
    const cases: [string, object, number, string, string | null][] = [
      [planned, { control: 'smoker', value: '70' }, 409, 'not-started', null],
      [discarded, { control: 'smoker', value: '70' }, 409, 'discarded', null],
      [lot, { control: 'fryer', value: '70' }, 422, 'unknown-control', 'control'],
      [lot, { control: 'smoker', value: 'warm' }, 422, 'bad-reading', 'value'],
      // Five minutes ahead of the server's clock is allowed; a second more is not.
      [lot, { control: 'smoker', value: '70', at: at(5.02) }, 422, 'bad-time', 'at'],
      [lot, { control: 'smoker', value: '70', extra: 1 }, 400, 'bad-request', null],
      ['260302-TC-99', { control: 'smoker', value: '70' }, 404, 'not-found', null],
    ];
    for (const [target, body, status, code, field] of cases) {
      const response = await rosa.post(`/api/batches/${target}/readings`, body);
      assert.equal(response.status, status, `${JSON.stringify(body)}: ${response.text}`);
      assert.equal(response.json.error.code, code);
      assert.ok(response.json.error.message.length > 10);
      if (field) assert.equal(response.json.error.details[0].field, field);
    }
    assert.equal(await rowCount(server, 'readings'), 0);
    const inTime = await reading(rosa, lot, 'smoker', '70', at(5));
    assert.equal(inTime.reading.at, at(5));
  });

  it('should name where a reading came from: the console, the larder command, another script', async (t) => {
    const { server } = await startProcessServer(t);
    const rosa = server.as('rosa');
    const lot = await recordControlled(rosa);
    const viaScript = await reading(rosa, lot, 'smoker', '70', at(0));
    assert.equal(viaScript.reading.source, 'api');
    const larder = await rosa.post(
      `/api/batches/${lot}/readings`,
      { control: 'smoker', value: '71' },
      { 'x-larder-client': 'larder' },
    );
    assert.equal(larder.json.reading.source, 'command');
    assert.equal(larder.json.reading.at, at(0));
    const session = await reading(await server.signIn('imke'), lot, 'smoker', '72', at(1));
    assert.equal(session.reading.source, 'console');
    assert.equal(session.reading.by.displayName, 'Imke Tressaly (food safety)');
  });
});
