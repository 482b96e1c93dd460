import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { assertErrorEnvelope, batchCounts } from '../helpers/api-calls.ts';
import { clockFrom, startTestServer, type ApiResponse } from '../helpers/test-server.ts';

// The server's today: a start may lie from 2025-12-03 to 2027-12-03 (365 days either way).
// source: our start-day window (shared/calculation/start-window.ts)
const TODAY = '2026-12-03';
const RANGE = 'a batch can start from 3 Dec 2025 to 3 Dec 2027';
// The days as a cook reads them on the console. source: the calendar
const WORDS: Readonly<Record<string, string>> = {
  '9999-12-31': '31 Dec 9999',
  '2126-12-24': '24 Dec 2126',
  '2027-12-04': '4 Dec 2027',
  '2025-12-02': '2 Dec 2025',
  '1990-06-01': '1 Jun 1990',
};

const belly = (start: string) => ({
  formula: 'quillmoor-belly',
  batch: { meat: '4.26kg', thickness: '4cm', start },
});

/** Asserts a 400 'bad-batch' naming --start, its side of the window and the days allowed. */
function assertOutOfWindow(response: ApiResponse, start: string, side: 'ahead' | 'back'): void {
  assertErrorEnvelope(response, start);
  assert.equal(response.status, 400, response.text);
  assert.equal(response.json.error.code, 'bad-batch');
  assert.equal(
    response.json.error.message,
    `--start ${WORDS[start]} is more than a year ${side}: ${RANGE} (a year either side of today, 3 Dec 2026)`,
  );
  assert.deepEqual(response.json.error.details, [{ option: 'start' }]);
}

const FAR: readonly [string, 'ahead' | 'back'][] = [
  ['9999-12-31', 'ahead'],
  // Would make lot 261224-QB-01, which reads as 2026.
  ['2126-12-24', 'ahead'],
  ['2027-12-04', 'ahead'],
  ['2025-12-02', 'back'],
  ['1990-06-01', 'back'],
];

describe('start days outside a year of today', () => {
  it('should refuse to record them with a 400 that names --start, recording nothing', async (t) => {
    const server = await startTestServer(t, {}, { now: clockFrom(TODAY) });
    const before = await batchCounts(server);
    for (const [start, side] of FAR) {
      assertOutOfWindow(await server.as('tobin').post('/api/batches', belly(start)), start, side);
    }
    assert.deepEqual(await batchCounts(server), before);
  });

  it('should refuse them in a calculation and a formula preview too', async (t) => {
    const server = await startTestServer(t, {}, { now: clockFrom(TODAY) });
    for (const [start, side] of FAR) {
      assertOutOfWindow(await server.as('tobin').post('/api/calc', belly(start)), start, side);
      const preview = await server
        .as('tobin')
        .post('/api/formulas/quillmoor-belly/preview', { batch: belly(start).batch });
      assertOutOfWindow(preview, start, side);
    }
  });

  it('should record a batch made on paper a year ago, and one planned a year ahead', async (t) => {
    const server = await startTestServer(t, {}, { now: clockFrom(TODAY) });
    const back = await server.as('tobin').post('/api/batches', belly('2025-12-03'));
    assert.equal(back.status, 201, back.text);
    // source: our lot code format (server/README.md "Batches"): start day YYMMDD, formula
    // initials, sequence
    assert.equal(back.json.batch.lotCode, '251203-QB-01');
    const ahead = await server
      .as('tobin')
      .post('/api/batches', { ...belly('2027-12-03'), status: 'planned' });
    assert.equal(ahead.status, 201, ahead.text);
    assert.equal(ahead.json.batch.lotCode, '271203-QB-01');
  });

  it('should refuse a plan for a service day more than a year ahead, recording nothing', async (t) => {
    const server = await startTestServer(t, {}, { now: clockFrom(TODAY) });
    const before = await batchCounts(server);
    for (const route of ['/api/plans', '/api/plans/record']) {
      for (const [day, words] of [
        ['2126-12-24', '24 Dec 2126'],
        ['9999-12-31', '31 Dec 9999'],
        ['2027-12-04', '4 Dec 2027'],
      ]) {
        const response = await server
          .as('tobin')
          .post(route, { assembly: 'smokehouse-burger', count: 120, for: day });
        assertErrorEnvelope(response, `${route} ${day}`);
        assert.equal(response.status, 400, response.text);
        assert.equal(
          response.json.error.message,
          // A cook reads it on the Plans page: days in words, as every date there.
          `the service date ${words} is more than a year ahead: plan for a day up to 3 Dec 2027 (a year from today, 3 Dec 2026)`,
        );
      }
    }
    assert.deepEqual(await batchCounts(server), before);
  });
});
