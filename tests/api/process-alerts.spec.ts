import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { AppContext } from '../../server/app-context.ts';
import { openContext } from '../../server/main-context.ts';
import { ProcessAlertScheduler } from '../../server/process/process-alert-scheduler.ts';
import { giveDemoAddresses, readMessage, readOutbox } from '../helpers/mail.ts';
import { startTestServer, type TestServer } from '../helpers/test-server.ts';

const COOLER = 'Alert test cooler';

/**
 * A cooler held at or below 41 °F (5 °C), read at 9 °C: a deviation.
 * source: FDA Food Code 2022, §3-501.16(A)(2) Cold holding
 */
async function coolerDeviation(server: TestServer): Promise<void> {
  const added = await server.as('rosa').post('/api/equipment', {
    name: COOLER,
    kind: 'cooler',
    control: { rule: 'cold-holding', every: '4 h' },
  });
  assert.equal(added.status, 201, added.text);
  const read = await server
    .as('tobin')
    .post(`/api/equipment/${added.json.equipment.id}/readings`, { value: '9 °C' });
  assert.equal(read.status, 201, read.text);
  assert.ok(read.json.deviation, 'a reading over the limit opens a deviation');
}

const runOn = (context: AppContext) =>
  context.records
    .processRecords()
    .then((deps) => new ProcessAlertScheduler(context, deps).runOnce());

/** The cooler's process alerts in the outbox, as "address: subject", sorted. */
async function alertsOf(server: TestServer): Promise<string[]> {
  return (await readOutbox(server))
    .filter((m) => m.kind === 'process-alert' && m.related === COOLER)
    .map((m) => `${m.to}: ${m.subject}`)
    .sort();
}

// Admins and cooks get process alerts by default; reviewers do not (server/reminders).
const ONCE = [
  `rosa@quillmoor.invalid: Deviation: ${COOLER} is on hold`,
  `tobin@quillmoor.invalid: Deviation: ${COOLER} is on hold`,
];

describe('process alerts through the outbox', () => {
  it('should send a deviation alert once to admins and cooks, and nothing again after a restart', async (t) => {
    const server = await startTestServer(t);
    await giveDemoAddresses(server);
    await coolerDeviation(server);
    const first = await runOn(server.context);
    assert.deepEqual(
      first.filter((a) => a.kind === 'deviation').map((a) => [...a.recipients].sort()),
      [['rosa', 'tobin']],
    );
    assert.deepEqual(await alertsOf(server), ONCE);
    const [message] = (await readOutbox(server)).filter((m) => m.related === COOLER);
    assert.match((await readMessage(server, message.id)).text, /corrective action/);
    // Again in the same process, then on the same file after a restart: nothing new.
    assert.deepEqual(await runOn(server.context), []);
    await server.restart();
    assert.deepEqual(await runOn(server.context), []);
    assert.deepEqual(await alertsOf(server), ONCE);
  });

  it('should send it once when two servers on one database decide it at the same moment', async (t) => {
    const server = await startTestServer(t);
    await giveDemoAddresses(server);
    await coolerDeviation(server);
    const second = await openContext(server.context.config);
    t.after(async () => {
      second.formulas.close();
      await second.mail.close();
      await second.db.close();
    });
    const [a, b] = await Promise.all([runOn(server.context), runOn(second)]);
    assert.equal([...a, ...b].filter((alert) => alert.kind === 'deviation').length, 1);
    await second.mail.delivery.idle();
    assert.deepEqual(await alertsOf(server), ONCE);
  });

  it('should follow a person who turns process alerts off', async (t) => {
    const server = await startTestServer(t);
    await giveDemoAddresses(server);
    const choices = await server.as('tobin').get('/api/people/me/reminders');
    assert.equal(choices.json.processAlerts, true);
    const off = await server.as('tobin').request('PUT', '/api/people/me/reminders', {
      ...choices.json.choices,
      processAlerts: false,
    });
    assert.equal(off.status, 200, off.text);
    assert.equal(off.json.processAlerts, false);
    await coolerDeviation(server);
    await runOn(server.context);
    assert.deepEqual(await alertsOf(server), [ONCE[0]]);
  });
});
