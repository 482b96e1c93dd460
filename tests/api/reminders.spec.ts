import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import type { AppContext } from '../../server/app-context.ts';
import { ReminderScheduler } from '../../server/reminders/reminder-scheduler.ts';
import {
  giveDemoAddresses,
  handClock,
  localNoon,
  readMessage,
  readOutbox,
  type HandClock,
  type OutboxRow,
} from '../helpers/mail.ts';
import { startTestServer, type TestServer } from '../helpers/test-server.ts';

// The demo belly (formulas/quillmoor-belly.yaml) at 4 cm: 2 days per cm = 8 days from
// Thu 29 Feb 2024 (a leap day), ready Fri 8 Mar; flipped every 2 days: 2, 4 and 6 Mar.
// source: the formula's own hold rule (days_per_cm: 2, min_days: 7, flip_every_days: 2)
const START = '2024-02-29';
const BELLY = {
  formula: 'quillmoor-belly',
  batch: { meat: '4.26kg', thickness: '4cm', start: START },
} as const;
const FLIPS = ['2024-03-02', '2024-03-04', '2024-03-06'];
const READY = '2024-03-08';
const OVERDUE = '2024-03-09';

const ROSA = 'rosa@quillmoor.invalid';
const TOBIN = 'tobin@quillmoor.invalid';
const IMKE = 'imke@quillmoor.invalid';

/** A server on a hand clock, the demo people with addresses. */
async function setUp(t: { after(fn: () => unknown): void }): Promise<{
  server: TestServer;
  clock: HandClock;
}> {
  const clock = handClock(localNoon(START));
  const server = await startTestServer(t, {}, { now: clock.now });
  await giveDemoAddresses(server);
  return { server, clock };
}

/** Records the demo belly as the cook and moves it to the given status. */
async function belly(server: TestServer, ...moves: string[]): Promise<string> {
  const recorded = await server.as('tobin').post('/api/batches', BELLY);
  assert.equal(recorded.status, 201, recorded.text);
  const lot = recorded.json.batch.lotCode as string;
  assert.equal(recorded.json.batch.readyOn, READY);
  for (const to of moves) {
    const body = to === 'discarded' ? { to, reason: 'Cooler failed overnight.' } : { to };
    const moved = await server.as('tobin').post(`/api/batches/${lot}/status`, body);
    assert.equal(moved.status, 200, moved.text);
  }
  return lot;
}

/** A scheduler on the server's current context (a new one after a restart). */
const scheduler = (server: TestServer, clock: HandClock): ReminderScheduler =>
  new ReminderScheduler(server.context, { now: clock.now });

/** Runs the scheduler at noon of a day. */
async function runOn(server: TestServer, clock: HandClock, day: string) {
  clock.set(localNoon(day));
  return scheduler(server, clock).runOnce();
}

/** A lot's reminders in the outbox as "kind dueDay → addresses", oldest first. */
async function remindersOf(server: TestServer, lot: string): Promise<string[]> {
  const rows = (await readOutbox(server)).filter((m) => m.related === lot).reverse();
  const lines = new Map<string, string[]>();
  for (const row of rows) {
    const label = `${row.kind} ${row.createdAt.slice(0, 10)}`;
    lines.set(label, [...(lines.get(label) ?? []), row.to]);
  }
  return [...lines].map(([label, to]) => `${label} → ${to.sort().join(', ')}`);
}

async function count(context: AppContext, table: string): Promise<number> {
  const [row] = await context.db.sequelize.query<{ n: number }>(
    `SELECT COUNT(*) AS n FROM ${table}`,
    { type: QueryTypes.SELECT },
  );
  return row.n;
}

/** The UTC day of the clock's noon on a local day, as createdAt shows it. */
const stamp = (day: string): string => localNoon(day).toISOString().slice(0, 10);

describe('reminders', () => {
  it('should send each flip, the ready and the overdue reminder once, to the people who want them, across a restart', async (t) => {
    const { server, clock } = await setUp(t);
    const lot = await belly(server, 'curing');

    // The start day and the day after: nothing due.
    for (const day of [START, '2024-03-01']) {
      assert.deepEqual((await runOn(server, clock, day)).sent, [], day);
    }

    // First flip day: cooks and admins by default, not the reviewer.
    const first = await runOn(server, clock, FLIPS[0]);
    assert.deepEqual(
      first.sent.map((s) => [s.lotCode, s.kind, s.dueOn, [...s.recipients].sort()]),
      [[lot, 'flip', FLIPS[0], ['rosa', 'tobin']]],
    );
    assert.deepEqual(await remindersOf(server, lot), [
      `reminder-flip ${stamp(FLIPS[0])} → ${ROSA}, ${TOBIN}`,
    ]);

    // The same instant again, and later that day: nothing new.
    assert.deepEqual((await runOn(server, clock, FLIPS[0])).sent, []);
    clock.advance(6 * 3_600_000);
    assert.deepEqual((await scheduler(server, clock).runOnce()).sent, []);

    // A restart: the context closed and a new one opened on the same file; the same instant.
    const outboxBefore = await count(server.context, 'outbox');
    await server.restart();
    assert.deepEqual((await runOn(server, clock, FLIPS[0])).sent, []);
    assert.equal(await count(server.context, 'outbox'), outboxBefore);

    // Tobin turns flip reminders off for himself.
    const choices = await server
      .as('tobin')
      .request('PUT', '/api/people/me/reminders', { flip: false, ready: true, overdue: true });
    assert.equal(choices.status, 200, choices.text);

    for (const day of FLIPS.slice(1)) await runOn(server, clock, day);
    await runOn(server, clock, '2024-03-07');
    await runOn(server, clock, READY);
    await runOn(server, clock, OVERDUE);
    // Days later, still curing: nothing more.
    assert.deepEqual((await runOn(server, clock, '2024-03-20')).sent, []);
    await server.restart();
    assert.deepEqual((await runOn(server, clock, '2024-03-20')).sent, []);

    assert.deepEqual(await remindersOf(server, lot), [
      `reminder-flip ${stamp(FLIPS[0])} → ${ROSA}, ${TOBIN}`,
      `reminder-flip ${stamp(FLIPS[1])} → ${ROSA}`,
      `reminder-flip ${stamp(FLIPS[2])} → ${ROSA}`,
      `reminder-ready ${stamp(READY)} → ${ROSA}, ${TOBIN}`,
      `reminder-overdue ${stamp(OVERDUE)} → ${IMKE}, ${ROSA}, ${TOBIN}`,
    ]);
    const sent = await server.context.db.sequelize.query<{
      kind: string;
      due_on: string;
      recipients: number;
    }>('SELECT kind, due_on, recipients FROM reminders_sent ORDER BY id', {
      type: QueryTypes.SELECT,
    });
    assert.deepEqual(
      sent.map((r) => `${r.kind} ${r.due_on} ${r.recipients}`),
      [
        `flip ${FLIPS[0]} 2`,
        `flip ${FLIPS[1]} 1`,
        `flip ${FLIPS[2]} 1`,
        `ready ${READY} 2`,
        `overdue ${OVERDUE} 3`,
      ],
    );
    // The system sent them: audited without a person.
    const audit = await server.as('rosa').get('/api/audit?action=reminder-send');
    assert.equal(audit.json.events.length, 5);
    assert.equal(audit.json.events[0].actorName, null);
    assert.deepEqual(audit.json.events[0].detail, {
      kind: 'overdue',
      dueOn: OVERDUE,
      to: ['rosa', 'tobin', 'imke'],
      // No mail server in these tests: kept in the outbox, never said to be sent.
      kept: true,
    });
  });

  it('should word each reminder with the lot, its days and how to change one’s choices', async (t) => {
    const { server, clock } = await setUp(t);
    const lot = await belly(server, 'curing');
    await runOn(server, clock, FLIPS[0]);
    await runOn(server, clock, OVERDUE);
    const rows = (await readOutbox(server)).filter((m) => m.to === TOBIN);
    const subjects = rows.map((r) => r.subject).reverse();
    const title = 'Quillmoor belly, dry equilibrium cure';
    assert.deepEqual(subjects, [
      `Turn today: lot ${lot} (${title})`,
      `Ready since 8 Mar 2024: lot ${lot} (${title})`,
      `Overdue: lot ${lot} (${title}) is still curing, ready 8 Mar 2024`,
    ]);
    const flip = await readMessage(server, rows[rows.length - 1].id);
    assert.match(flip.text, /Hello Tobin Marrowfeld \(cook\),/);
    assert.match(flip.text, /due to be turned on 2 Mar 2024/);
    assert.match(flip.text, /every 2 days/);
    assert.match(flip.text, /started on 29 Feb 2024 and is ready on 8 Mar 2024/);
    assert.ok(flip.text.includes(`${server.url}/batches/${lot}`));
    assert.match(flip.text, /Larderbook at Quillmoor Smokehouse/);
    assert.match(flip.text, /“My reminders” in the account menu/);
    assert.match(flip.text, /include turn-day reminders/);
    const ready = await readMessage(server, rows[1].id);
    assert.match(ready.text, /was due on 8 Mar 2024; Larderbook was not running then/);
  });

  it('should catch up after the server was down: the latest missed flip, and ready and overdue once', async (t) => {
    const { server, clock } = await setUp(t);
    const lot = await belly(server, 'curing');
    // Down from the start until the day after the second flip day: only that flip is still owed.
    const late = await runOn(server, clock, '2024-03-05');
    assert.deepEqual(
      late.sent.map((s) => `${s.kind} ${s.dueOn}`),
      [`flip ${FLIPS[1]}`],
    );
    // Down again through the ready day and the day after.
    const back = await runOn(server, clock, '2024-03-12');
    assert.deepEqual(
      back.sent.map((s) => `${s.kind} ${s.dueOn}`),
      [`ready ${READY}`, `overdue ${OVERDUE}`],
    );
    // Flip to rosa and tobin, ready to rosa and tobin, overdue to all three.
    assert.equal((await readOutbox(server)).filter((m) => m.related === lot).length, 2 + 2 + 3);
  });

  it('should not chase a batch recorded from paper for days already past when it was recorded', async (t) => {
    const { server, clock } = await setUp(t);
    // Made from 29 Feb, entered on 20 Mar: past its ready day (8 Mar) and overdue day (9 Mar).
    clock.set(localNoon('2024-03-20'));
    const finished = await belly(server, 'curing');
    // Entered on 5 Mar: the flips of 2 and 4 Mar have passed; 6 Mar, ready and overdue have not.
    clock.set(localNoon('2024-03-05'));
    const midway = await belly(server, 'curing');

    assert.deepEqual((await runOn(server, clock, '2024-03-05')).sent, []);
    for (const day of [FLIPS[2], READY, OVERDUE]) await runOn(server, clock, day);
    const later = await runOn(server, clock, '2024-03-20');
    assert.deepEqual(later.sent, [], 'nothing for the batch recorded on 20 Mar');
    await runOn(server, clock, '2024-04-20');

    assert.deepEqual(await remindersOf(server, finished), []);
    assert.deepEqual(await remindersOf(server, midway), [
      `reminder-flip ${stamp(FLIPS[2])} → ${ROSA}, ${TOBIN}`,
      `reminder-ready ${stamp(READY)} → ${ROSA}, ${TOBIN}`,
      `reminder-overdue ${stamp(OVERDUE)} → ${IMKE}, ${ROSA}, ${TOBIN}`,
    ]);
  });

  it('should send nothing for a done, discarded or not yet curing batch', async (t) => {
    const { server, clock } = await setUp(t);
    const done = await belly(server, 'curing');
    const discarded = await belly(server, 'curing', 'discarded');
    const inProgress = await belly(server);
    await runOn(server, clock, FLIPS[0]);
    const moved = await server.as('tobin').post(`/api/batches/${done}/status`, { to: 'done' });
    assert.equal(moved.status, 200);
    // The ready day and the overdue day pass; the done batch was finished before them.
    for (const day of [READY, OVERDUE, '2024-03-15']) await runOn(server, clock, day);
    const rows = await readOutbox(server);
    assert.deepEqual(
      rows.filter((m) => m.related === done).map((m) => m.kind),
      ['reminder-flip', 'reminder-flip'],
    );
    assert.equal(rows.filter((m) => m.related === discarded).length, 0);
    assert.equal(rows.filter((m) => m.related === inProgress).length, 0);
  });

  it('should send nothing to people without an address or deactivated, and record the reminder anyway', async (t) => {
    const { server, clock } = await setUp(t);
    const people = (await server.as('rosa').get('/api/people')).json.people as {
      id: number;
      username: string;
    }[];
    const id = (name: string) => people.find((p) => p.username === name)?.id;
    await server.as('rosa').request('PATCH', `/api/people/${id('tobin')}`, { email: null });
    await server.as('rosa').request('PATCH', `/api/people/${id('rosa')}`, { email: null });
    const lot = await belly(server, 'curing');
    const run = await runOn(server, clock, FLIPS[0]);
    assert.deepEqual(
      run.sent.map((s) => [s.kind, s.recipients]),
      [['flip', []]],
    );
    assert.equal((await readOutbox(server)).filter((m) => m.related === lot).length, 0);
    // An address added later does not bring back a reminder already decided.
    await server.as('rosa').request('PATCH', `/api/people/${id('tobin')}`, { email: TOBIN });
    assert.deepEqual((await runOn(server, clock, FLIPS[0])).sent, []);
    // A deactivated reviewer gets no overdue reminder.
    await server.as('rosa').request('PATCH', `/api/people/${id('imke')}`, { active: false });
    const overdue = await runOn(server, clock, OVERDUE);
    assert.deepEqual(
      overdue.sent.map((s) => [s.kind, s.recipients]),
      [
        ['ready', ['tobin']],
        ['overdue', ['tobin']],
      ],
    );
  });

  it('should never send one reminder twice when two processes run at the same instant', async (t) => {
    const { server, clock } = await setUp(t);
    const lot = await belly(server, 'curing');
    clock.set(localNoon(OVERDUE));
    // A second process on the same database file: its own context, connections and queue.
    const { openContext } = await import('../../server/main-context.ts');
    const other = await openContext(server.context.config, { now: clock.now });
    t.after(async () => {
      await other.mail.close();
      await other.db.close();
    });
    const runs = await Promise.all([
      scheduler(server, clock).runOnce(),
      new ReminderScheduler(other, { now: clock.now }).runOnce(),
      scheduler(server, clock).runOnce(),
      new ReminderScheduler(other, { now: clock.now }).runOnce(),
    ]);
    const decided = runs.flatMap((run) => run.sent.map((s) => `${s.kind} ${s.dueOn}`)).sort();
    // On the overdue day no flip is owed any more (the hold is over): ready and overdue, each
    // decided by exactly one of the four runs.
    assert.deepEqual(decided, [`overdue ${OVERDUE}`, `ready ${READY}`]);
    await other.mail.delivery.idle();
    const rows = (await readOutbox(server)).filter((m: OutboxRow) => m.related === lot);
    assert.equal(rows.length, 2 + 3, 'ready to rosa and tobin, overdue to all three');
    assert.equal(new Set(rows.map((r) => `${r.kind} ${r.to}`)).size, rows.length);
  });

  it('should lose nothing when a run fails before its transaction commits', async (t) => {
    const { server, clock } = await setUp(t);
    const lot = await belly(server, 'curing');
    clock.set(localNoon(FLIPS[0]));
    // The outbox breaks after the reminders_sent row is written: the whole write rolls back.
    const outbox = server.context.mail.outbox;
    const broken = Object.create(outbox, {
      enqueue: {
        value: async () => {
          throw new Error('the disk is full');
        },
      },
    }) as typeof outbox;
    const crashing = new ReminderScheduler(
      { ...server.context, mail: { ...server.context.mail, outbox: broken } },
      { now: clock.now },
    );
    await assert.rejects(crashing.runOnce(), /the disk is full/);
    assert.equal(await count(server.context, 'reminders_sent'), 0);
    assert.equal((await readOutbox(server)).filter((m) => m.related === lot).length, 0);
    // The next run, after the "crash", sends it.
    const run = await scheduler(server, clock).runOnce();
    assert.deepEqual(
      run.sent.map((s) => `${s.kind} ${s.dueOn}`),
      [`flip ${FLIPS[0]}`],
    );
    assert.equal((await readOutbox(server)).filter((m) => m.related === lot).length, 2);
  });

  it('should run at start and then on its interval until stopped', async (t) => {
    const { server, clock } = await setUp(t);
    const lot = await belly(server, 'curing');
    clock.set(localNoon(FLIPS[0]));
    const errors: unknown[] = [];
    const timed = new ReminderScheduler(server.context, {
      now: clock.now,
      intervalMinutes: 0.001,
      report: (error) => errors.push(error),
    });
    timed.start();
    t.after(() => timed.stop());
    const waitFor = async (n: number): Promise<void> => {
      for (let i = 0; i < 200; i++) {
        if ((await readOutbox(server)).filter((m) => m.related === lot).length >= n) return;
        await new Promise((resolve) => setTimeout(resolve, 20));
      }
      assert.fail(`fewer than ${n} reminders arrived`);
    };
    await waitFor(2);
    clock.set(localNoon(FLIPS[1]));
    await waitFor(4);
    await timed.stop();
    assert.deepEqual(errors, []);
  });
});

describe('reminder choices over the API', () => {
  it('should give each role its defaults until the person chooses', async (t) => {
    const server = await startTestServer(t);
    const expected = {
      rosa: { flip: true, ready: true, overdue: true },
      tobin: { flip: true, ready: true, overdue: true },
      imke: { flip: false, ready: false, overdue: true },
    } as const;
    for (const [user, choices] of Object.entries(expected)) {
      const response = await server
        .as(user as keyof typeof expected)
        .get('/api/people/me/reminders');
      assert.equal(response.status, 200, response.text);
      assert.deepEqual(response.json.choices, choices, user);
      assert.deepEqual(response.json.defaults, choices, user);
      assert.equal(response.json.chosen, false);
      assert.equal(response.json.email, `${user}@quillmoor.invalid`);
    }
  });

  it('should keep each person’s own choices and audit the change', async (t) => {
    const server = await startTestServer(t);
    const imke = await server.signIn('imke');
    const put = await imke.request('PUT', '/api/people/me/reminders', {
      flip: false,
      ready: true,
      overdue: false,
    });
    assert.equal(put.status, 200, put.text);
    assert.deepEqual(put.json.choices, { flip: false, ready: true, overdue: false });
    assert.equal(put.json.chosen, true);
    assert.deepEqual((await imke.get('/api/people/me/reminders')).json.choices, put.json.choices);
    // Nobody else's changed.
    assert.equal((await server.as('tobin').get('/api/people/me/reminders')).json.chosen, false);
    const audit = await server.as('rosa').get('/api/audit?action=reminder-choices');
    assert.equal(audit.json.events[0].subject, 'imke');
    assert.deepEqual(audit.json.events[0].detail, { flip: false, ready: true, overdue: false });
  });

  it('should say when there is no address to send to', async (t) => {
    const server = await startTestServer(t);
    const people = (await server.as('rosa').get('/api/people')).json.people as {
      id: number;
      username: string;
    }[];
    const tobin = people.find((p) => p.username === 'tobin');
    await server.as('rosa').request('PATCH', `/api/people/${tobin?.id}`, { email: null });
    assert.equal((await server.as('tobin').get('/api/people/me/reminders')).json.email, null);
  });

  it('should refuse bad choices, other people’s choices and anonymous callers', async (t) => {
    const server = await startTestServer(t);
    for (const body of [
      { flip: true, ready: true },
      { flip: 'yes', ready: true, overdue: true },
      { flip: true, ready: true, overdue: true, email: 'x@y.z' },
    ]) {
      const response = await server.as('tobin').request('PUT', '/api/people/me/reminders', body);
      assert.equal(response.status, 400, JSON.stringify(body));
    }
    assert.equal((await server.as('anonymous').get('/api/people/me/reminders')).status, 401);
    assert.equal(
      (
        await server
          .as('anonymous')
          .request('PUT', '/api/people/me/reminders', { flip: true, ready: true, overdue: true })
      ).status,
      401,
    );
    // There is no route to anyone else's: /people/:id/reminders is not one.
    assert.equal((await server.as('rosa').get('/api/people/2/reminders')).status, 404);
    const tobin = await server.signIn('tobin');
    const forged = await tobin.request(
      'PUT',
      '/api/people/me/reminders',
      { flip: false, ready: false, overdue: false },
      { 'x-csrf-token': 'forged' },
    );
    assert.equal(forged.status, 403);
  });
});
