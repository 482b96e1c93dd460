import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import { EquipmentDueScheduler } from '../../server/equipment/equipment-due-scheduler.ts';
import {
  giveDemoAddresses,
  handClock,
  localNoon,
  readMessage,
  readOutbox,
} from '../helpers/mail.ts';
import { startTestServer } from '../helpers/test-server.ts';

const HOUR = 3_600_000;
const MINUTE = 60_000;

describe('equipment due reminders', () => {
  it('should remind once of a reading and a check not taken on time, across a restart', async (t) => {
    const clock = handClock(localNoon('2024-03-04'));
    const server = await startTestServer(t, {}, { now: clock.now });
    await giveDemoAddresses(server);
    // Tobin wants no overdue reminders but keeps process alerts; equipment readings are process
    // alerts, so they follow the second choice.
    const before = await server.as('tobin').get('/api/people/me/reminders');
    const choice = await server.as('tobin').request('PUT', '/api/people/me/reminders', {
      ...before.json.choices,
      overdue: false,
      processAlerts: true,
    });
    assert.equal(choice.status, 200, choice.text);
    const add = async (body: object): Promise<number> => {
      const added = await server.as('rosa').post('/api/equipment', body);
      assert.equal(added.status, 201, added.text);
      return added.json.equipment.id;
    };
    const cooler = await add({
      name: 'Prep cooler',
      kind: 'cooler',
      control: { rule: 'cold-holding', every: '4 h' },
    });
    const probe = await add({
      name: 'Spare probe',
      kind: 'thermometer',
      control: { every: '168 h' },
    });
    const read = await server.as('tobin').post(`/api/equipment/${cooler}/readings`, {
      value: '3 °C',
    });
    assert.equal(read.status, 201, read.text);
    const check = await server.as('tobin').post(`/api/equipment/${probe}/calibrations`, {
      reading: '0 °C',
      outcome: 'ok',
    });
    assert.equal(check.status, 201, check.text);
    const readAt = Date.parse(read.json.reading.at);

    const run = async (): Promise<string[]> => {
      const sent = await new EquipmentDueScheduler(server.context, { now: clock.now }).runOnce();
      // The run kicked the outbox's delivery: let it finish (the server may stop next).
      await server.context.mail.delivery.idle();
      return sent
        .filter((s) => s.equipmentId === cooler || s.equipmentId === probe)
        .map((s) => `${s.name} ${s.dueAt} → ${[...s.recipients].sort().join(', ')}`);
    };
    const mine = async () =>
      (await readOutbox(server)).filter((m) =>
        ['Prep cooler', 'Spare probe'].includes(m.related ?? ''),
      );

    // Due at 4 h after the reading (the control's every), chased 30 minutes later.
    clock.set(new Date(readAt + 4 * HOUR + 29 * MINUTE));
    assert.deepEqual(await run(), []);
    clock.set(new Date(readAt + 4 * HOUR + 30 * MINUTE));
    const due = new Date(readAt + 4 * HOUR).toISOString();
    // Process alerts: admins and cooks by default, not reviewers
    // (server/reminders/reminder-prefs-repository.ts); Tobin by his own choice.
    assert.deepEqual(await run(), [`Prep cooler ${due} → rosa, tobin`]);
    assert.equal((await mine()).length, 2);
    const message = await readMessage(server, (await mine())[0]!.id);
    assert.match(message.subject, /^Overdue: Prep cooler reading, due /);
    assert.equal(message.kind, 'process-alert');
    assert.match(message.text, /your choices include process alerts/);
    assert.doesNotMatch(message.text, /overdue reminders/);

    // Later runs, and a restart: not again.
    clock.advance(2 * HOUR);
    assert.deepEqual(await run(), []);
    await server.restart();
    assert.deepEqual(await run(), []);
    assert.equal((await mine()).length, 2);

    // A reading taken: the next one is due 4 h on, and is chased once in its turn.
    const again = await server.as('tobin').post(`/api/equipment/${cooler}/readings`, {
      value: '3.5 °C',
    });
    assert.equal(again.status, 201, again.text);
    clock.advance(5 * HOUR);
    const next = new Date(Date.parse(again.json.reading.at) + 4 * HOUR).toISOString();
    assert.deepEqual(await run(), [`Prep cooler ${next} → rosa, tobin`]);

    // The thermometer's week: its check is chased once, then no more.
    clock.set(new Date(Date.parse(check.json.calibration.at) + 168 * HOUR + HOUR));
    const sent = await run();
    assert.ok(
      sent.some((line) => line.startsWith('Spare probe')),
      sent.join('\n'),
    );
    assert.deepEqual(
      (await run()).filter((line) => line.startsWith('Spare probe')),
      [],
    );
    const rows = await server.context.db.sequelize.query<{
      dedupe_key: string;
      recipients: number;
    }>(
      `SELECT dedupe_key, recipients FROM process_alerts_sent WHERE kind = 'equipment-due'
       AND equipment_id IN (?, ?) ORDER BY id`,
      { replacements: [cooler, probe], type: QueryTypes.SELECT },
    );
    assert.equal(rows.length, 3, JSON.stringify(rows));
    assert.equal(new Set(rows.map((r) => r.dedupe_key)).size, 3);
  });

  it('should not chase retired equipment', async (t) => {
    const clock = handClock(localNoon('2024-03-04'));
    const server = await startTestServer(t, {}, { now: clock.now });
    const added = await server.as('rosa').post('/api/equipment', {
      name: 'Old cooler',
      kind: 'cooler',
      control: { rule: 'cold-holding', every: '4 h' },
    });
    const id = added.json.equipment.id;
    await server.as('rosa').request('PATCH', `/api/equipment/${id}`, { active: false });
    clock.advance(10 * HOUR);
    const sent = await new EquipmentDueScheduler(server.context, { now: clock.now }).runOnce();
    // The run kicked the outbox's delivery: let it finish before the server stops.
    await server.context.mail.delivery.idle();
    assert.deepEqual(
      sent.filter((s) => s.equipmentId === id),
      [],
    );
  });
});
