import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import { inTakenOrder, recordReadings } from '../../server/process/record-readings.ts';
import { at, reading, recordControlled, startProcessServer } from '../helpers/process-calls.ts';
import { addReadings, idOf } from '../helpers/process-rows.ts';
import type { HandClock } from '../helpers/mail.ts';
import type { TestServer } from '../helpers/test-server.ts';

/** A reason with what JSON must escape, and what it must not. */
const AWKWARD =
  'Probe "B" misread\nre-taken\tat the core \\ 3 cm; ½ °F · ☃ \u2028 \u0001\u001f\u007f';

/**
 * A batch with what a record can hold: readings by two people (one signed in at the console,
 * one over HTTP Basic), one entered in °F, a logger file, a corrected reading and its
 * correction, two readings taken at the same moment, one of them written first with a later id.
 */
async function busyBatch(server: TestServer, clock: HandClock): Promise<string> {
  const tobin = await server.signIn('tobin');
  const rosa = server.as('rosa');
  const lot = await recordControlled(tobin);
  clock.set(new Date(at(400)));
  // source: the fixture's smoker limit, 60–80 °C (the kitchen's own): 17 °C is a miss
  const typo = await reading(tobin, lot, 'smoker', '17 °C', at(0));
  const fixed = await rosa.post(`/api/readings/${typo.reading.id}/correction`, {
    value: '71 °C',
    reason: AWKWARD,
  });
  assert.equal(fixed.status, 201, fixed.text);
  await reading(rosa, lot, 'smoker', '158 °F', at(30));
  const lines = Array.from({ length: 90 }, (_, m) => `${at(60 + m)},${(70 - m / 4).toFixed(2)}`);
  const upload = await tobin.post(
    `/api/batches/${lot}/readings/upload?control=chill`,
    `Timestamp,Temperature (°C)\n${lines.join('\n')}\n`,
    { 'content-type': 'text/csv' },
  );
  assert.equal(upload.status, 201, upload.text);
  // Two hold readings at one moment, and one earlier written after them: oldest first is by the
  // time, then by the id, not by the order they were written.
  const batchId = await idOf(server, 'batches', lot);
  const imke = await idOf(server, 'people', 'imke');
  await addReadings(server, [
    { batchId, control: 'hold', at: at(300), value: '3.9', source: 'api', by: imke },
    { batchId, control: 'hold', at: at(300), value: '4.1', source: 'api', by: null },
    { batchId, control: 'hold', at: at(200), value: '4', source: 'command', by: imke },
  ]);
  return lot;
}

describe('the process record as the API writes it', () => {
  it('should send the very text of the record built reading by reading', async (t) => {
    const { server, clock } = await startProcessServer(t);
    const lot = await busyBatch(server, clock);
    const answer = await server.as('imke').get(`/api/batches/${lot}/process`);
    assert.equal(answer.status, 200, answer.text);
    assert.equal(answer.headers.get('content-type'), 'application/json; charset=utf-8');
    assert.equal(answer.headers.get('cache-control'), 'no-store');
    assert.equal(Number(answer.headers.get('content-length')), Buffer.byteLength(answer.text));
    // What the route sent before its readings were written by SQLite: each row a Reading
    // (toReading), judged by judgeBatch, the whole stringified as res.json does.
    const built = await server.context.records.processRecord(lot, at(400));
    assert.equal(answer.text, JSON.stringify(built));

    const smoker = built.controls.find((c) => c.control.id === 'smoker')!;
    assert.equal(smoker.readings.length, 3);
    assert.equal(smoker.readings[1]!.reason, AWKWARD);
    assert.equal(smoker.readings[0]!.correctedBy, smoker.readings[1]!.id);
    assert.equal(smoker.readings[2]!.enteredAs, '158 °F');
    assert.deepEqual(
      smoker.readings.map((r) => r.by?.displayName ?? null),
      ['Tobin Marrowfeld (cook)', 'Rosa Quennick (head cook)', 'Rosa Quennick (head cook)'],
    );
    // The corrected 17 °C is shown but not judged: the chamber is within its limit.
    assert.equal(smoker.state.misses.length, 0);
    const hold = built.controls.find((c) => c.control.id === 'hold')!;
    assert.deepEqual(
      hold.readings.map((r) => [r.at, r.value, r.by?.displayName ?? null]),
      [
        [at(200), '4', 'Imke Tressaly (food safety)'],
        [at(300), '3.9', 'Imke Tressaly (food safety)'],
        [at(300), '4.1', null],
      ],
    );
    const chill = built.controls.find((c) => c.control.id === 'chill')!;
    assert.equal(chill.readings.length, 90);
    assert.ok(chill.readings.every((r) => r.source === 'logger'));
  });

  it('should read the same with the readings sorted by SQLite as without', async (t) => {
    const { server, clock } = await startProcessServer(t);
    const lot = await busyBatch(server, clock);
    const select = <T extends object>(sql: string, values: readonly number[]) =>
      server.context.db.sequelize.query<T>(sql, {
        replacements: [...values],
        type: QueryTypes.SELECT,
      });
    const batchId = await idOf(server, 'batches', lot);
    const { dialect } = server.context.db;
    const asStored = await recordReadings(select, batchId, dialect);
    assert.deepEqual(await recordReadings(select, batchId, dialect, true), asStored);
    assert.deepEqual([...asStored.keys()].sort(), ['chill', 'hold', 'smoker']);
    // The corrected 17 °C is not among the smoker's standing readings.
    assert.deepEqual(
      asStored.get('smoker')!.standing.map((p) => p.value),
      ['71', '70'],
    );
  });

  it('should tell readings out of order by time, then id', () => {
    const [a, b] = ['2026-03-02T12:00:00.000Z', '2026-03-02T12:01:00.000Z'];
    assert.equal(inTakenOrder([1, 2, 3], [a, a, b]), true);
    assert.equal(inTakenOrder([2, 1, 3], [a, a, b]), false);
    assert.equal(inTakenOrder([1, 2], [b, a]), false);
    assert.equal(inTakenOrder([], []), true);
  });
});
