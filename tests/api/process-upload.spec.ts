import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { cookieSession, send } from '../helpers/api-calls.ts';
import {
  at,
  processOf,
  reading,
  recordControlled,
  rowCount,
  startProcessServer,
} from '../helpers/process-calls.ts';

const CSV = { 'content-type': 'text/csv' };

/** A logger's export: a header, then one line per minute from T0, in °C with the zone written. */
function loggerCsv(values: readonly string[]): string {
  const lines = values.map((value, minute) => `${at(minute)},${value}`);
  return `Timestamp,Temperature (°C)\n${lines.join('\n')}\n`;
}

describe('uploading a data logger’s file', () => {
  it('should take a day of points at one a minute, 1,440 readings, in one write', async (t) => {
    const { server, clock } = await startProcessServer(t);
    const tobin = await server.signIn('tobin');
    const lot = await recordControlled(tobin);
    clock.set(new Date(at(1440)));
    // source: the fixture's smoker limit, 60–80 °C (the kitchen's own): 68–72 °C stays inside
    const values = Array.from({ length: 1440 }, (_, i) => String(68 + (i % 5)));
    const started = Date.now();
    const response = await tobin.post(
      `/api/batches/${lot}/readings/upload?control=smoker`,
      loggerCsv(values),
      CSV,
    );
    const ms = Date.now() - started;
    assert.equal(response.status, 201, response.text);
    assert.deepEqual(response.json, {
      added: 1440,
      alreadyStored: 0,
      deviations: [],
      message: '1,440 readings stored.',
    });
    const smoker = (await processOf(server, lot)).controls.find((c) => c.control.id === 'smoker')!;
    assert.equal(smoker.readings.length, 1440);
    assert.ok(smoker.readings.every((r) => r.source === 'logger'));
    assert.equal(smoker.readings[1439]!.at, at(1439));
    const audit = await server.as('rosa').get('/api/audit?action=readings-upload');
    assert.equal(audit.json.events[0].detail.count, 1440);
    t.diagnostic(`1,440 points stored and judged in ${ms} ms`);

    // The same file again: nothing is stored twice, and the answer says so.
    const again0 = Date.now();
    const again = await tobin.post(
      `/api/batches/${lot}/readings/upload?control=smoker`,
      loggerCsv(values),
      CSV,
    );
    const againMs = Date.now() - again0;
    assert.equal(again.status, 200, again.text);
    assert.deepEqual(again.json, {
      added: 0,
      alreadyStored: 1440,
      deviations: [],
      message: 'Nothing new: all 1,440 readings in this file were stored already.',
    });
    assert.equal(
      (await processOf(server, lot)).controls.find((c) => c.control.id === 'smoker')!.readings
        .length,
      1440,
    );
    t.diagnostic(`the same 1,440 points found stored already in ${againMs} ms`);
  });

  it('should store only the new points of a file that overlaps one stored before', async (t) => {
    const { server, clock } = await startProcessServer(t);
    const rosa = server.as('rosa');
    const lot = await recordControlled(rosa);
    clock.set(new Date(at(60)));
    // source: the fixture's smoker limit, 60–80 °C (the kitchen's own): 70 °C stays inside
    const first = await rosa.post(
      `/api/batches/${lot}/readings/upload?control=smoker`,
      loggerCsv(Array.from({ length: 10 }, () => '70')),
      CSV,
    );
    assert.equal(first.status, 201, first.text);
    assert.equal(first.json.added, 10);
    // Minutes 0–14: the first ten as before, five new; minute 3 read 71 °C, a point of its own.
    const values = Array.from({ length: 15 }, (_, minute) => (minute === 3 ? '71' : '70'));
    const second = await rosa.post(
      `/api/batches/${lot}/readings/upload?control=smoker`,
      loggerCsv(values),
      CSV,
    );
    assert.equal(second.status, 201, second.text);
    assert.equal(second.json.added, 6);
    assert.equal(second.json.alreadyStored, 9);
    assert.equal(
      second.json.message,
      '6 new readings stored; 9 in this file were stored already and were not stored again.',
    );
    // The same point typed by hand is not the logger's: the file's point is stored beside it.
    await reading(rosa, lot, 'smoker', '70', at(20));
    const third = await rosa.post(
      `/api/batches/${lot}/readings/upload?control=smoker`,
      loggerCsv(Array.from({ length: 21 }, () => '70')),
      CSV,
    );
    assert.equal(third.json.added, 6, third.text);
    assert.equal(await rowCount(server, 'readings'), 10 + 6 + 1 + 6);
    const audit = await server.as('rosa').get('/api/audit?action=readings-upload');
    assert.deepEqual(
      audit.json.events.map((e: { detail: { count: number } }) => e.detail.count),
      [6, 6, 10],
    );
  });

  it('should refuse a file with a bad line at that line and store nothing', async (t) => {
    const { server, clock } = await startProcessServer(t);
    const rosa = server.as('rosa');
    const lot = await recordControlled(rosa);
    clock.set(new Date(at(10)));
    const text = loggerCsv(['70', '70', 'seventy', '70']);
    const response = await rosa.post(
      `/api/batches/${lot}/readings/upload?control=smoker`,
      text,
      CSV,
    );
    assert.equal(response.status, 422, response.text);
    assert.equal(response.json.error.code, 'bad-log');
    // The header is line 1, so the third point is line 4.
    assert.equal(response.json.error.details[0].line, 4);
    assert.match(response.json.error.message, /line 4/);
    assert.equal(await rowCount(server, 'readings'), 0);
    assert.equal(await rowCount(server, 'deviations'), 0);
  });

  it('should open the deviation of a slow cool found in the file, and read local times in the kitchen’s zone', async (t) => {
    const { server, clock } = await startProcessServer(t);
    const tobin = await server.signIn('tobin');
    const lot = await recordControlled(tobin);
    // source: FSIS Appendix B (1999) option 1: from 130 °F (54.4 °C) to 80 °F (26.7 °C) within
    // 1.5 h; this log is still at 30 °C after 2 h, then reaches 26 °C at 2 h 10 min.
    const start = new Date(2026, 2, 2, 13, 0);
    clock.set(new Date(start.getTime() + 300 * 60_000));
    const local = (minutes: number): string => {
      const d = new Date(start.getTime() + minutes * 60_000);
      const pad = (n: number): string => String(n).padStart(2, '0');
      return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())} ${pad(d.getHours())}:${pad(d.getMinutes())}`;
    };
    const text = [
      'Date/Time,Temp (°C)',
      `${local(0)},55`,
      `${local(60)},40`,
      `${local(120)},30`,
      `${local(130)},26`,
    ].join('\n');
    // The cook reached 70 °C first, so only the cool can miss.
    await reading(
      tobin,
      lot,
      'cook',
      '71 °C',
      new Date(start.getTime() - 5 * 60_000).toISOString(),
    );
    const form = new FormData();
    form.append('file', new Blob([text], { type: 'text/csv' }), 'chiller-log.csv');
    const session = await cookieSession(server, 'tobin');
    const response = await send(server, session, {
      method: 'POST',
      path: `/api/batches/${lot}/readings/upload?control=chill`,
      body: form,
    });
    assert.equal(response.status, 201, response.text);
    assert.equal(response.json.added, 4);
    assert.deepEqual(
      response.json.deviations.map((d: { control: string; kind: string }) => [d.control, d.kind]),
      [['chill', 'reading']],
    );
    const chill = (await processOf(server, lot)).controls.find((c) => c.control.id === 'chill')!;
    assert.equal(chill.readings[0]!.at, start.toISOString());
  });

  it('should refuse a file over 20,000 lines, a control the batch does not have, and a JSON body', async (t) => {
    const { server, clock } = await startProcessServer(t);
    const rosa = server.as('rosa');
    const lot = await recordControlled(rosa);
    clock.set(new Date(at(30_000)));
    const big = loggerCsv(Array.from({ length: 20_001 }, () => '70'));
    const tooBig = await rosa.post(`/api/batches/${lot}/readings/upload?control=smoker`, big, CSV);
    assert.equal(tooBig.status, 413, tooBig.text);
    const unknown = await rosa.post(
      `/api/batches/${lot}/readings/upload?control=fryer`,
      loggerCsv(['70']),
      CSV,
    );
    assert.equal(unknown.status, 422, unknown.text);
    assert.equal(unknown.json.error.code, 'unknown-control');
    const json = await rosa.post(`/api/batches/${lot}/readings/upload?control=smoker`, {
      points: [],
    });
    assert.equal(json.status, 415, json.text);
    assert.equal(await rowCount(server, 'readings'), 0);
  });
});
