import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { handClock, localNoon } from '../helpers/mail.ts';
import {
  at,
  cleanRun,
  move,
  recordControlled,
  rowCount,
  startProcessServer,
} from '../helpers/process-calls.ts';
import type { AuditEvent } from '../../shared/api/audit-event.ts';
import type { BatchListItem, BatchTurn } from '../../shared/api/batch-record.ts';
import {
  startTestServer,
  type ApiClient,
  type ApiResponse,
  type TestServer,
} from '../helpers/test-server.ts';

// The demo belly (formulas/quillmoor-belly.yaml) at 4 cm from Thu 29 Feb 2024: ready Fri 8 Mar,
// turned every 2 days, on 2, 4 and 6 Mar.
// source: the formula's own hold rule (days_per_cm: 2, min_days: 7, flip_every_days: 2)
const START = '2024-02-29';
const BELLY = {
  formula: 'quillmoor-belly',
  batch: { meat: '4.26kg', thickness: '4cm', start: START },
} as const;
const TOBIN = 'Tobin Marrowfeld (cook)';
const ROSA = 'Rosa Quennick (head cook)';

/** A server whose clock stands at noon of the belly's first turning day until moved. */
async function setUp(t: { after(fn: () => unknown): void }) {
  const clock = handClock(localNoon('2024-03-02'));
  const server = await startTestServer(t, {}, { now: clock.now });
  return { server, clock };
}

/** Records the belly as the cook and moves it along; returns its lot. */
async function belly(server: TestServer, ...moves: string[]): Promise<string> {
  const recorded = await server.as('tobin').post('/api/batches', BELLY);
  assert.equal(recorded.status, 201, recorded.text);
  const lot = recorded.json.batch.lotCode as string;
  for (const to of moves) {
    const body = to === 'discarded' ? { to, reason: 'Cooler failed overnight.' } : { to };
    const moved = await server.as('tobin').post(`/api/batches/${lot}/status`, body);
    assert.equal(moved.status, 200, moved.text);
  }
  return lot;
}

/** The lot's item in the log of curing batches. */
async function listed(client: ApiClient, lot: string) {
  const page = await client.get('/api/batches?status=curing&limit=200');
  assert.equal(page.status, 200, page.text);
  return (page.json.items as BatchListItem[]).find((item) => item.lotCode === lot);
}

/** Asserts a refusal with its status and code. */
function refused(response: ApiResponse, status: number, code: string) {
  assert.equal(response.status, status, response.text);
  assert.equal(response.json.error.code, code, response.text);
}

describe('turning a curing batch', () => {
  it('should record today’s turn by the person signed in, list it, carry it on the log and audit it', async (t) => {
    const { server, clock } = await setUp(t);
    const lot = await belly(server, 'curing');
    const tobin = server.as('tobin');
    assert.equal((await listed(tobin, lot))?.lastTurn, null);

    const first = await tobin.post(`/api/batches/${lot}/turns`, {
      note: '  Rubbed back the cure that ran off.  ',
    });
    assert.equal(first.status, 201, first.text);
    assert.deepEqual(
      first.json.batch.turns.map((turn: BatchTurn) => [turn.on, turn.by.displayName, turn.note]),
      [['2024-03-02', TOBIN, 'Rubbed back the cure that ran off.']],
    );
    assert.equal(first.json.batch.turns[0].at, localNoon('2024-03-02').toISOString());

    // The next day, Rosa turns it with no body at all.
    clock.set(localNoon('2024-03-03'));
    const second = await server.as('rosa').post(`/api/batches/${lot}/turns`);
    assert.equal(second.status, 201, second.text);
    assert.deepEqual(
      second.json.batch.turns.map((turn: BatchTurn) => [turn.on, turn.by.displayName, turn.note]),
      [
        ['2024-03-02', TOBIN, 'Rubbed back the cure that ran off.'],
        ['2024-03-03', ROSA, null],
      ],
    );
    const read = await server.as('imke').get(`/api/batches/${lot}`);
    assert.equal(read.json.batch.turns.length, 2);

    const item = (await listed(server.as('imke'), lot))!;
    assert.equal(item.lastTurn?.on, '2024-03-03');
    assert.equal(item.lastTurn?.by.displayName, ROSA);
    assert.equal(item.lastTurn?.at, localNoon('2024-03-03').toISOString());

    const audit = await server.as('rosa').get(`/api/audit?action=batch-turn&subject=${lot}`);
    assert.deepEqual(
      audit.json.events.map((e: AuditEvent) => [e.actorName, e.detail]),
      [
        ['rosa', { on: '2024-03-03' }],
        ['tobin', { on: '2024-03-02', note: 'Rubbed back the cure that ran off.' }],
      ],
    );
  });

  it('should refuse a second turn the same day, naming who turned it and when', async (t) => {
    const { server, clock } = await setUp(t);
    const lot = await belly(server, 'curing');
    assert.equal((await server.as('tobin').post(`/api/batches/${lot}/turns`)).status, 201);
    clock.advance(90 * 60_000);
    const again = await server.as('rosa').post(`/api/batches/${lot}/turns`, { note: 'Again' });
    refused(again, 409, 'already-turned');
    assert.match(
      again.json.error.message,
      /already turned today, by Tobin Marrowfeld \(cook\) at 12:00/,
    );
    const read = await server.as('imke').get(`/api/batches/${lot}`);
    assert.equal(read.json.batch.turns.length, 1);
  });

  it('should turn only a cure that is curing, and only for a cook or an admin', async (t) => {
    const { server } = await setUp(t);
    // The demo's own cures have turns already: nothing refused adds one.
    const demoTurns = await rowCount(server, 'batch_turns');
    const planned = await server.as('tobin').post('/api/batches', { ...BELLY, status: 'planned' });
    const cases: [string, number, string, RegExp][] = [
      [planned.json.batch.lotCode, 409, 'not-curing', /is planned, not curing/],
      [await belly(server), 409, 'not-curing', /is in progress, not curing/],
      [await belly(server, 'discarded'), 409, 'discarded', /was discarded/],
      ['240229-QB-99', 404, 'not-found', /no batch/],
    ];
    for (const [lot, status, code, words] of cases) {
      const response = await server.as('tobin').post(`/api/batches/${lot}/turns`);
      refused(response, status, code);
      assert.match(response.json.error.message, words);
    }
    const curing = await belly(server, 'curing');
    refused(await server.as('imke').post(`/api/batches/${curing}/turns`), 403, 'forbidden');
    const long = await server.as('tobin').post(`/api/batches/${curing}/turns`, {
      note: 'x'.repeat(501),
    });
    refused(long, 400, 'bad-request');
    refused(
      await server.as('tobin').post(`/api/batches/${curing}/turns`, { by: 'x' }),
      400,
      'bad-request',
    );
    assert.equal(await rowCount(server, 'batch_turns'), demoTurns);
    const audit = await server.as('rosa').get('/api/audit?action=batch-turn');
    assert.equal(audit.json.events.length, 0);
  });

  it('should refuse to turn a batch whose record was verified and released', async (t) => {
    const { server, clock } = await startProcessServer(t);
    const tobin = await server.signIn('tobin');
    const lot = await recordControlled(tobin);
    await cleanRun(tobin, lot, clock);
    await move(tobin, lot, 'curing', 'done');
    const verified = await (
      await server.signIn('imke')
    ).post(`/api/batches/${lot}/verify`, {
      note: 'Logs reviewed.',
    });
    assert.equal(verified.status, 201, verified.text);
    clock.set(new Date(at(480)));
    const response = await tobin.post(`/api/batches/${lot}/turns`);
    refused(response, 409, 'released');
    assert.match(response.json.error.message, /record is closed/);
  });
});
