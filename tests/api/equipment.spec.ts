import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { startTestServer, type TestServer } from '../helpers/test-server.ts';

/** The demo's walk-in cooler: the template cold-holding, every 4 h. */
async function cooler(server: TestServer): Promise<{ id: number; name: string }> {
  const list = await server.as('tobin').get('/api/equipment');
  assert.equal(list.status, 200, list.text);
  const found = list.json.equipment.find((e: { name: string }) => e.name === 'Walk-in cooler');
  assert.ok(found, 'the demo has a walk-in cooler');
  return found;
}

/** A thermometer of one's own, checked every 168 h. */
async function thermometer(server: TestServer, name = 'Test probe'): Promise<number> {
  const added = await server.as('rosa').post('/api/equipment', {
    name,
    kind: 'thermometer',
    control: { every: '168 h' },
  });
  assert.equal(added.status, 201, added.text);
  return added.json.equipment.id;
}

const minutesAgo = (minutes: number): string =>
  new Date(Date.now() - minutes * 60_000).toISOString();

async function deviationsOf(
  server: TestServer,
  id: number,
): Promise<{ what: string; closed: boolean }[]> {
  const log = await server.as('imke').get(`/api/equipment/${id}/log`);
  assert.equal(log.status, 200, log.text);
  return log.json.deviations;
}

describe('equipment readings', () => {
  it('should open a deviation once for a cooler reading above 5 °C (41 °F), and none at the limit', async (t) => {
    const server = await startTestServer(t);
    const { id } = await cooler(server);
    // source: FDA Food Code 2022, §3-501.16(A)(2): cold holding at 5 °C (41 °F) or less
    const atLimit = await server.as('tobin').post(`/api/equipment/${id}/readings`, {
      value: '41 °F',
      at: minutesAgo(30),
    });
    assert.equal(atLimit.status, 201, atLimit.text);
    assert.equal(atLimit.json.deviation, null);
    assert.equal(atLimit.json.reading.enteredAs, '41 °F');
    assert.equal(atLimit.json.equipment.state.status, 'in-progress');

    const at = minutesAgo(10);
    const warm = await server.as('tobin').post(`/api/equipment/${id}/readings`, {
      value: '6 °C',
      at,
    });
    assert.equal(warm.status, 201, warm.text);
    assert.ok(warm.json.deviation, 'a deviation is opened');
    assert.match(warm.json.deviation.what, /^Walk-in cooler: 6 °C/);
    assert.equal(warm.json.equipment.state.status, 'missed');
    assert.equal(warm.json.reading.deviationId, warm.json.deviation.id);

    // The same reading entered again (the same time) does not open a second one.
    const again = await server.as('imke').post(`/api/equipment/${id}/readings`, {
      value: '6 °C',
      at,
    });
    assert.equal(again.status, 201, again.text);
    assert.equal(again.json.deviation, null);
    assert.equal((await deviationsOf(server, id)).length, 1);

    // Back in range: the cooler shows in the limit again; the deviation stays until an action.
    const cold = await server
      .as('tobin')
      .post(`/api/equipment/${id}/readings`, { value: '3.5 °C' });
    assert.equal(cold.json.equipment.state.status, 'in-progress');
    const [deviation] = await deviationsOf(server, id);
    assert.equal(deviation.closed, false);

    const audit = await server.as('rosa').get('/api/audit?action=deviation-open');
    assert.equal(audit.json.events[0].subject, 'Walk-in cooler');
  });

  it('should close an equipment deviation with a corrective action, as any other', async (t) => {
    const server = await startTestServer(t);
    const { id } = await cooler(server);
    const warm = await server.as('tobin').post(`/api/equipment/${id}/readings`, { value: '9 °C' });
    const deviationId = warm.json.deviation.id;
    const action = await server.as('tobin').post(`/api/deviations/${deviationId}/action`, {
      cause: 'The door was left ajar during a delivery.',
      restored: 'Door shut; read 3.5 °C half an hour later.',
      prevention: 'A door alarm after two minutes open.',
      disposition: 'rechilled',
    });
    assert.equal(action.status, 201, action.text);
    assert.equal(action.json.deviation.action.disposition, 'rechilled');
    const [closed] = await deviationsOf(server, id);
    assert.equal(closed.closed, true);
    const audit = await server.as('rosa').get('/api/audit?action=corrective-action');
    assert.equal(audit.json.events[0].subject, 'Walk-in cooler');
  });

  it('should say the next reading is due every 4 h after the last', async (t) => {
    const server = await startTestServer(t);
    const { id } = await cooler(server);
    const at = minutesAgo(5);
    const answer = await server.as('tobin').post(`/api/equipment/${id}/readings`, {
      value: '3 °C',
      at,
    });
    assert.equal(answer.status, 201, answer.text);
    // source: the demo cooler's control, every 4 h
    assert.equal(
      answer.json.equipment.nextDue,
      new Date(Date.parse(at) + 4 * 3_600_000).toISOString(),
    );
    assert.equal(answer.json.equipment.overdue, false);
  });

  it('should refuse a reading that is not a temperature, a time to come and a retired unit', async (t) => {
    const server = await startTestServer(t);
    const { id } = await cooler(server);
    const bad = await server.as('tobin').post(`/api/equipment/${id}/readings`, { value: 'cold' });
    assert.equal(bad.status, 422, bad.text);
    assert.equal(bad.json.error.details[0].field, 'value');
    const later = new Date(Date.now() + 3_600_000).toISOString();
    const future = await server.as('tobin').post(`/api/equipment/${id}/readings`, {
      value: '3 °C',
      at: later,
    });
    assert.equal(future.status, 422, future.text);
    const retired = await server
      .as('rosa')
      .request('PATCH', `/api/equipment/${id}`, { active: false });
    assert.equal(retired.status, 200, retired.text);
    const refused = await server
      .as('tobin')
      .post(`/api/equipment/${id}/readings`, { value: '3 °C' });
    assert.equal(refused.status, 409, refused.text);
    assert.equal(refused.json.error.code, 'retired');
  });

  it('should show a period’s readings, deviations and checks in the log', async (t) => {
    const server = await startTestServer(t);
    const { id } = await cooler(server);
    const log = await server.as('imke').get(`/api/equipment/${id}/log`);
    assert.equal(log.status, 200, log.text);
    // The demo's twelve readings, every 4 h, all within the last week.
    assert.equal(log.json.readings.length, 12);
    assert.deepEqual(log.json.deviations, []);
    const empty = await server
      .as('imke')
      .get(`/api/equipment/${id}/log?from=2020-01-01&to=2020-01-31`);
    assert.equal(empty.json.readings.length, 0);
    const backwards = await server
      .as('imke')
      .get(`/api/equipment/${id}/log?from=2020-02-01&to=2020-01-01`);
    assert.equal(backwards.status, 400);
    assert.equal((await server.as('imke').get('/api/equipment/999/log')).status, 404);
  });
});

describe('thermometer calibration', () => {
  it('should refuse ok at +1.5 °C in ice water, and take adjusted', async (t) => {
    const server = await startTestServer(t);
    const id = await thermometer(server);
    // The ice-point check: within ±1 °C of 0 °C. common practice, no source
    const refused = await server.as('tobin').post(`/api/equipment/${id}/calibrations`, {
      reading: '1.5 °C',
      outcome: 'ok',
    });
    assert.equal(refused.status, 422, refused.text);
    assert.equal(refused.json.error.code, 'ice-point');
    assert.match(refused.json.error.message, /1\.5 °C off 0 °C, more than the 1 °C allowed/);
    assert.match(refused.json.error.message, /Adjust it .* or retire it/);

    const adjusted = await server.as('tobin').post(`/api/equipment/${id}/calibrations`, {
      reading: '1.5 °C',
      outcome: 'adjusted',
      note: 'Turned the nut to 0 °C, read 0.1 °C after.',
    });
    assert.equal(adjusted.status, 201, adjusted.text);
    assert.equal(adjusted.json.calibration.outcome, 'adjusted');
    assert.equal(adjusted.json.calibration.reading, '1.5');
    assert.equal(adjusted.json.equipment.active, true);

    const ok = await server.as('imke').post(`/api/equipment/${id}/calibrations`, {
      reading: '0.5 °C',
      outcome: 'ok',
    });
    assert.equal(ok.status, 201, ok.text);
    // source: the thermometer's control, every 168 h (7 days)
    assert.equal(
      ok.json.equipment.nextDue,
      new Date(Date.parse(ok.json.calibration.at) + 168 * 3_600_000).toISOString(),
    );
  });

  it('should mark a retired thermometer out of use', async (t) => {
    const server = await startTestServer(t);
    const id = await thermometer(server);
    const retired = await server.as('tobin').post(`/api/equipment/${id}/calibrations`, {
      reading: '36 °F',
      outcome: 'retired',
      note: 'Dropped; reads 4 °F high.',
    });
    assert.equal(retired.status, 201, retired.text);
    assert.equal(retired.json.equipment.active, false);
    assert.equal(retired.json.equipment.nextDue, null);
    const again = await server.as('tobin').post(`/api/equipment/${id}/calibrations`, {
      reading: '32 °F',
      outcome: 'ok',
    });
    assert.equal(again.status, 409);
  });

  it('should take readings only of units and checks only of thermometers', async (t) => {
    const server = await startTestServer(t);
    const id = await thermometer(server);
    const { id: coolerId } = await cooler(server);
    const reading = await server
      .as('tobin')
      .post(`/api/equipment/${id}/readings`, { value: '0 °C' });
    assert.equal(reading.status, 409);
    const check = await server.as('tobin').post(`/api/equipment/${coolerId}/calibrations`, {
      reading: '0 °C',
      outcome: 'ok',
    });
    assert.equal(check.status, 409);
  });
});

describe('managing equipment', () => {
  it('should add a freezer with its own limit and source, listed with its state', async (t) => {
    const server = await startTestServer(t);
    const added = await server.as('rosa').post('/api/equipment', {
      name: 'Reach-in freezer',
      kind: 'freezer',
      control: {
        // source: USDA FSIS, "Freezing and Food Safety": 0 °F or below keeps food safe
        limit: { max: '0 °F' },
        source: 'USDA FSIS, Freezing and Food Safety',
        every: '12 h',
      },
    });
    assert.equal(added.status, 201, added.text);
    const freezer = added.json.equipment;
    assert.equal(freezer.state.status, 'waiting');
    assert.equal(freezer.overdue, true, 'the first reading is due at once');
    // 0 °F = −17.8 °C. source: NIST SP 811 (2008), t/°C = (t/°F − 32) × 5/9
    assert.match(freezer.limitWords, /at or below -17\.8 °C \(0 °F\), every 12 h/);
    const warm = await server
      .as('tobin')
      .post(`/api/equipment/${freezer.id}/readings`, { value: '-15 °C' });
    assert.ok(warm.json.deviation);
    const audit = await server.as('rosa').get('/api/audit?action=equipment-add');
    assert.equal(audit.json.events[0].subject, 'Reach-in freezer');
  });

  it('should refuse a control the formula checks refuse, or that is not judged reading by reading', async (t) => {
    const server = await startTestServer(t);
    const add = (control: object) =>
      server.as('rosa').post('/api/equipment', { name: 'Cooler 2', kind: 'cooler', control });
    for (const control of [
      { limit: { max: '5 °C' }, every: '4 h' },
      { rule: 'no-such-rule', every: '4 h' },
      { rule: 'fsis-cooling-option-1', every: '4 h' },
      { rule: 'cold-holding', every: 'often' },
      { limit: { max: 'cold' }, source: 'ours', every: '4 h' },
    ]) {
      const response = await add(control);
      assert.equal(response.status, 422, `${JSON.stringify(control)}: ${response.text}`);
      assert.equal(response.json.error.details[0].field, 'control');
    }
    const thermo = await server.as('rosa').post('/api/equipment', {
      name: 'Probe 9',
      kind: 'thermometer',
      control: { rule: 'cold-holding', every: '168 h' },
    });
    assert.equal(thermo.status, 422);
    const taken = await add({ rule: 'cold-holding', every: '4 h' });
    assert.equal(taken.status, 201);
    assert.equal((await add({ rule: 'cold-holding', every: '4 h' })).status, 409);
  });

  it('should audit a change of the limit with old and new and a reason, and keep past judgements', async (t) => {
    const server = await startTestServer(t);
    const { id } = await cooler(server);
    const warm = await server
      .as('tobin')
      .post(`/api/equipment/${id}/readings`, { value: '4.5 °C' });
    assert.equal(warm.json.deviation, null);
    const newControl = {
      limit: { max: '4 °C' },
      source: 'Quillmoor HACCP plan, 2026',
      every: '2 h',
    };
    const noReason = await server
      .as('rosa')
      .request('PATCH', `/api/equipment/${id}`, { control: newControl });
    assert.equal(noReason.status, 422);
    assert.equal(noReason.json.error.code, 'reason-needed');
    const changed = await server.as('rosa').request('PATCH', `/api/equipment/${id}`, {
      control: newControl,
      name: 'Walk-in cooler A',
      reason: 'Tighter limit after the door seal was replaced.',
    });
    assert.equal(changed.status, 200, changed.text);
    assert.equal(changed.json.equipment.name, 'Walk-in cooler A');
    // The latest reading is shown by the limit now in force; it opened no deviation and opens none.
    assert.equal(changed.json.equipment.state.status, 'missed');
    assert.equal((await deviationsOf(server, id)).length, 0);
    const audit = await server.as('rosa').get('/api/audit?action=equipment-change');
    const detail = audit.json.events[0].detail;
    assert.deepEqual(detail.control, {
      from: { rule: 'cold-holding', every: '4 h' },
      to: newControl,
    });
    assert.deepEqual(detail.name, { from: 'Walk-in cooler', to: 'Walk-in cooler A' });
    assert.equal(detail.reason, 'Tighter limit after the door seal was replaced.');
  });
});
