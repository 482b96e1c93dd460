import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { EquipmentDueScheduler } from '../../server/equipment/equipment-due-scheduler.ts';
import { ProcessAlertScheduler } from '../../server/process/process-alert-scheduler.ts';
import { ReminderScheduler } from '../../server/reminders/reminder-scheduler.ts';
import { BELLY as TODAY_BELLY } from '../helpers/api-calls.ts';
import { giveDemoAddresses, handClock, localNoon, readOutbox } from '../helpers/mail.ts';
import { OTHER_SITE, addPerson, addSite, sendAs } from '../helpers/site-fixture.ts';
import { startTestServer, type TestServer } from '../helpers/test-server.ts';

// Reminders, equipment reminders and process alerts about one site's records go to the people
// with a role there only, and name the site once the install has several. The demo's people
// have roles at every site; the tests add a cook of each site alone.
const HOUR = 3_600_000;
const START = '2024-02-29';
const SHOP = `${OTHER_SITE.name}: `;
const BELLY = { ...TODAY_BELLY, batch: { ...TODAY_BELLY.batch, start: START } };

/** Gives an added person an e-mail address, as an admin would. */
async function giveAddress(server: TestServer, username: string): Promise<void> {
  const people = (await server.as('rosa').get('/api/people')).json.people as {
    id: number;
    username: string;
  }[];
  const id = people.find((p) => p.username === username)?.id;
  const response = await server.as('rosa').request('PATCH', `/api/people/${id}`, {
    email: `${username}@quillmoor.invalid`,
  });
  assert.equal(response.status, 200, response.text);
}

/** The name of the install's first site (the kitchen's name setting, else a default). */
async function mainName(server: TestServer): Promise<string> {
  const sites = await server.as('rosa').get('/api/sites');
  return sites.json.sites.find((site: { key: string }) => site.key === 'main').name;
}

/** The outbox's messages about one record as "user: subject", sorted. */
async function mailAbout(server: TestServer, related: string): Promise<string[]> {
  return (await readOutbox(server))
    .filter((m) => m.related === related)
    .map((m) => `${m.to.replace('@quillmoor.invalid', '')}: ${m.subject}`)
    .sort();
}

describe('sites: mail about a site goes to its people and names it', () => {
  it('should send reminders, equipment reminders and process alerts to the people of the record’s site', async (t) => {
    const clock = handClock(localNoon(START));
    const server = await startTestServer(t, {}, { now: clock.now });
    await giveDemoAddresses(server);
    // Recorded at the only site: the mail names no site.
    const single = await server.as('tobin').post('/api/batches', BELLY);
    assert.equal(single.status, 201, single.text);
    const singleLot = single.json.batch.lotCode as string;

    await addSite(server, OTHER_SITE);
    await addPerson(server, 'shop-cook', null, [{ key: OTHER_SITE.key, role: 'cook' }]);
    await addPerson(server, 'main-cook', null, [{ key: 'main', role: 'cook' }]);
    await giveAddress(server, 'shop-cook');
    await giveAddress(server, 'main-cook');
    const move = async (lot: string, to: string) =>
      (await server.as('tobin').post(`/api/batches/${lot}/status?site=${to}`, { to: 'curing' }))
        .status;
    assert.equal(await move(singleLot, 'main'), 200);
    const shop = await sendAs(server, 'shop-cook', {
      method: 'POST',
      path: '/api/batches',
      body: BELLY,
    });
    assert.equal(shop.status, 201, shop.text);
    const shopLot = shop.json.batch.lotCode as string;
    const moved = await sendAs(server, 'shop-cook', {
      method: 'POST',
      path: `/api/batches/${shopLot}/status`,
      body: { to: 'curing' },
    });
    assert.equal(moved.status, 200, moved.text);

    // Every cure reminder due by the shop batch's ready day, at once.
    clock.set(localNoon('2024-03-20'));
    await new ReminderScheduler(server.context, { now: clock.now }).runOnce();
    const shopMail = await mailAbout(server, shopLot);
    const shopTo = new Set(shopMail.map((line) => line.split(':')[0]));
    // Cooks and admins get every kind by default; the reviewer only the overdue one.
    assert.deepEqual([...shopTo].sort(), ['imke', 'rosa', 'shop-cook', 'tobin']);
    assert.ok(
      shopMail.every((line) => line.split(': ').slice(1).join(': ').startsWith(SHOP)),
      shopMail.join('\n'),
    );
    const mainMail = await mailAbout(server, singleLot);
    const mainTo = new Set(mainMail.map((line) => line.split(':')[0]));
    assert.deepEqual([...mainTo].sort(), ['imke', 'main-cook', 'rosa', 'tobin']);
    const main = await mainName(server);
    assert.ok(
      mainMail.every((line) => line.includes(`: ${main}: `)),
      mainMail.join('\n'),
    );

    // A cooler of the shop: its overdue reading and its deviation go to the shop's people.
    const added = await server.as('rosa').post(`/api/equipment?site=${OTHER_SITE.key}`, {
      name: 'Shop cooler',
      kind: 'cooler',
      control: { rule: 'cold-holding', every: '4 h' },
    });
    assert.equal(added.status, 201, added.text);
    const cooler = added.json.equipment.id as number;
    await server.context.db.sequelize.query(
      'UPDATE equipment SET site_id = (SELECT id FROM sites WHERE key = ?) WHERE id = ?',
      { replacements: [OTHER_SITE.key, cooler] },
    );
    const read = await server
      .as('rosa')
      .post(`/api/equipment/${cooler}/readings?site=${OTHER_SITE.key}`, { value: '9 °C' });
    assert.equal(read.status, 201, read.text);
    assert.ok(read.json.deviation, 'a reading over the limit opens a deviation');
    const deps = await server.context.records.processRecords();
    await new ProcessAlertScheduler(server.context, deps, { now: clock.now }).runOnce();
    clock.set(new Date(Date.parse(read.json.reading.at) + 5 * HOUR));
    await new EquipmentDueScheduler(server.context, { now: clock.now }).runOnce();
    await server.context.mail.delivery.idle();
    const coolerMail = await mailAbout(server, 'Shop cooler');
    // Process alerts: admins and cooks by default, not reviewers; a deviation and an overdue reading.
    assert.deepEqual(
      coolerMail.map((line) => line.split(':')[0]),
      ['rosa', 'rosa', 'shop-cook', 'shop-cook', 'tobin', 'tobin'],
      coolerMail.join('\n'),
    );
    assert.ok(
      coolerMail.every((line) => line.split(': ').slice(1).join(': ').startsWith(SHOP)),
      coolerMail.join('\n'),
    );
  });

  it('should name no site in the mail of a single-site install', async (t) => {
    const clock = handClock(localNoon(START));
    const server = await startTestServer(t, {}, { now: clock.now });
    await giveDemoAddresses(server);
    const recorded = await server.as('tobin').post('/api/batches', BELLY);
    assert.equal(recorded.status, 201, recorded.text);
    const lot = recorded.json.batch.lotCode as string;
    const moved = await server.as('tobin').post(`/api/batches/${lot}/status`, { to: 'curing' });
    assert.equal(moved.status, 200, moved.text);
    clock.set(localNoon('2024-03-20'));
    await new ReminderScheduler(server.context, { now: clock.now }).runOnce();
    const mail = await mailAbout(server, lot);
    assert.ok(mail.length > 0);
    const main = await mainName(server);
    assert.ok(
      mail.every((line) => !line.includes(main)),
      mail.join('\n'),
    );
  });
});
