import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import {
  RECHILLED,
  at,
  cleanRun,
  move,
  processOf,
  reading,
  recordControlled,
  rowCount,
  startProcessServer,
} from '../helpers/process-calls.ts';
import type { ApiClient } from '../helpers/test-server.ts';

const TABLES = ['readings', 'weighings', 'corrective_actions', 'verifications', 'deviations'];

/** How many rows each process table has, as "table n". */
async function counts(server: Parameters<typeof rowCount>[0]): Promise<string[]> {
  return Promise.all(TABLES.map(async (table) => `${table} ${await rowCount(server, table)}`));
}

/** Asserts a refusal because the batch was released: 409, and words that say why. */
function refusedAsReleased(response: Awaited<ReturnType<ApiClient['post']>>, what: string): void {
  assert.equal(response.status, 409, `${what}: ${response.text}`);
  assert.equal(response.json.error.code, 'released', what);
  assert.match(response.json.error.message, /released/, what);
  assert.match(response.json.error.message, /record is closed/, what);
}

describe('a released batch', () => {
  it('should refuse new readings, corrections, logger files, weighings and corrective actions', async (t) => {
    const { server, clock } = await startProcessServer(t);
    const tobin = await server.signIn('tobin');
    const imke = await server.signIn('imke');
    const lot = await recordControlled(tobin);
    const green = await tobin.post(`/api/batches/${lot}/weighings`, {
      stage: { name: 'green', weight: '4.26 kg' },
    });
    assert.equal(green.status, 201, green.text);
    await cleanRun(tobin, lot, clock);
    // source: FDA Food Code 2022 §3-501.16(A)(2): 46 °F is over 41 °F, a deviation to close
    clock.set(new Date(at(420)));
    const warm = await reading(tobin, lot, 'hold', '46 °F', at(400));
    const deviation = warm.deviation.id as number;
    const action = await tobin.post(`/api/deviations/${deviation}/action`, RECHILLED);
    assert.equal(action.status, 201, action.text);
    await move(tobin, lot, 'curing', 'done');
    const verified = await imke.post(`/api/batches/${lot}/verify`, { note: 'Logs reviewed.' });
    assert.equal(verified.status, 201, verified.text);
    const before = await counts(server);
    const record = await processOf(server, lot);
    const hold = record.controls.find((c) => c.control.id === 'hold')!;

    clock.set(new Date(at(480)));
    // source: FDA Food Code 2022 §3-501.16(A)(2), cold holding at 41 °F or below
    const late = await tobin.post(`/api/batches/${lot}/readings`, {
      control: 'hold',
      value: '38 °F',
    });
    refusedAsReleased(late, 'a reading');
    const corrected = await tobin.post(`/api/readings/${hold.readings[0]!.id}/correction`, {
      value: '37 °F',
      reason: 'Typed the wrong figure.',
    });
    refusedAsReleased(corrected, 'a correction of a reading');
    const upload = await tobin.post(
      `/api/batches/${lot}/readings/upload?control=hold`,
      `Timestamp,Temperature (°C)\n${at(470)},3\n`,
      { 'content-type': 'text/csv' },
    );
    refusedAsReleased(upload, 'a logger file');
    const weighed = await tobin.post(`/api/batches/${lot}/weighings`, {
      stage: { name: 'cooked', weight: '3.9 kg' },
    });
    refusedAsReleased(weighed, 'a weighing');
    const reweighed = await tobin.post(`/api/weighings/${green.json.weighings[0].id}/correction`, {
      weight: '4.3 kg',
      reason: 'The scale was not zeroed.',
    });
    refusedAsReleased(reweighed, 'a correction of a weighing');
    const replaced = await tobin.post(`/api/deviations/${deviation}/action`, {
      ...RECHILLED,
      disposition: 'discarded',
      grams: '1.2 kg',
      reason: 'Thrown out after all.',
    });
    refusedAsReleased(replaced, 'a corrective action replaced');
    // A verification is recorded once: a second one is refused as before.
    const again = await imke.post(`/api/batches/${lot}/verify`, { note: 'Again.' });
    assert.equal(again.status, 409, again.text);
    assert.equal(again.json.error.code, 'already-verified');

    assert.deepEqual(await counts(server), before);
  });
});
