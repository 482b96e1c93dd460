import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { QueryTypes } from 'sequelize';
import * as loggerSummaries from '../../server/db/migrations/013-logger-summaries.ts';
import {
  LOGGER_SUMMARIES_SQL,
  LOGGER_SUMMARY_SQL,
  type LoggerRow,
} from '../../server/reports/haccp-queries.ts';
import { at, reading, recordControlled, startProcessServer } from '../helpers/process-calls.ts';
import { addReadings, idOf } from '../helpers/process-rows.ts';
import type { TestServer } from '../helpers/test-server.ts';

const CSV = { 'content-type': 'text/csv' };

/** A logger's export from T0, one line a minute, in °C. */
function loggerCsv(values: readonly string[]): string {
  return `Timestamp,Temperature (°C)\n${values.map((v, minute) => `${at(minute)},${v}`).join('\n')}\n`;
}

async function rows(server: TestServer, sql: string, values: unknown[]): Promise<LoggerRow[]> {
  return server.context.db.sequelize.query<LoggerRow>(sql, {
    replacements: values,
    type: QueryTypes.SELECT,
  });
}

/** The batch's summaries as the triggers keep them, and as SQLite sums the readings up now. */
async function bothWays(server: TestServer, batchId: number) {
  return {
    kept: await rows(server, LOGGER_SUMMARIES_SQL(1), [batchId]),
    summed: await rows(server, LOGGER_SUMMARY_SQL(server.context.db.dialect, 'batch_id', 1), [
      batchId,
    ]),
  };
}

describe('logger readings summed up per batch and control as they are written', () => {
  it('should equal the readings summed up, through logger files, hand readings and corrections', async (t) => {
    const { server, clock } = await startProcessServer(t);
    const tobin = await server.signIn('tobin');
    const lot = await recordControlled(tobin);
    const batchId = await idOf(server, 'batches', lot);
    clock.set(new Date(at(600)));
    // Invented values inside the fixture's limits (smoker 60–80 °C, the kitchen's own; cold
    // holding at most 5 °C, FDA Food Code 2022, §3-501.16(A)(2)): the lowest smoker reading is
    // 61.5 at minute 3, the highest 78 at minute 1.
    const smoker = ['70', '78', '65', '61.5', '70', '64'];
    for (const [control, values] of [
      ['smoker', smoker],
      ['hold', ['3.1', '2.8', '3.4']],
    ] as const) {
      const upload = await tobin.post(
        `/api/batches/${lot}/readings/upload?control=${control}`,
        loggerCsv(values),
        CSV,
      );
      assert.equal(upload.status, 201, upload.text);
    }
    await reading(tobin, lot, 'cook', '72', at(200));
    let { kept, summed } = await bothWays(server, batchId);
    assert.deepEqual(kept, summed);
    assert.deepEqual(
      kept.map((s) => [s.control, s.count, s.first, s.last, s.min, s.max]),
      [
        ['hold', 3, at(0), at(2), '2.8', '3.4'],
        ['smoker', 6, at(0), at(5), '61.5', '78'],
      ],
    );
    // A correction of the lowest and of the last smoker reading: neither stands any more.
    const ids = await server.context.db.sequelize.query<{ id: number }>(
      `SELECT id FROM readings WHERE batch_id = ? AND control = 'smoker' ORDER BY taken_at`,
      { replacements: [batchId], type: QueryTypes.SELECT },
    );
    for (const [index, value] of [
      [3, '66'],
      [5, '69'],
    ] as const) {
      const corrected = await tobin.post(`/api/readings/${ids[index]!.id}/correction`, {
        value,
        reason: 'The probe slipped out of the chamber.',
      });
      assert.equal(corrected.status, 201, corrected.text);
    }
    ({ kept, summed } = await bothWays(server, batchId));
    assert.deepEqual(kept, summed);
    assert.deepEqual(
      kept.map((s) => [s.control, s.count, s.first, s.last, s.min, s.max]),
      [
        ['hold', 3, at(0), at(2), '2.8', '3.4'],
        ['smoker', 4, at(0), at(4), '65', '78'],
      ],
    );
    // Written straight into the table, as a script would: equal values keep the earlier entry.
    await addReadings(server, [
      { batchId, control: 'smoker', at: at(7), value: '78.0', source: 'logger' },
      { batchId, control: 'smoker', at: at(8), value: '65.00', source: 'logger' },
      { batchId, control: 'chill', at: at(9), value: '20', source: 'logger' },
    ]);
    ({ kept, summed } = await bothWays(server, batchId));
    assert.deepEqual(kept, summed);
    assert.deepEqual(
      kept.map((s) => [s.control, s.count, s.first, s.last, s.min, s.max]),
      [
        ['chill', 1, at(9), at(9), '20', '20'],
        ['hold', 3, at(0), at(2), '2.8', '3.4'],
        ['smoker', 6, at(0), at(8), '65', '78'],
      ],
    );
    // The migration sums up the readings already there: dropped and made again, the same.
    const sequelize = server.context.db.sequelize;
    if (server.context.db.dialect === 'postgres') {
      // PostgreSQL's triggers (two) call functions, which the migration makes again too.
      for (const trigger of ['add', 'update'])
        await sequelize.query(`DROP TRIGGER logger_summaries_${trigger} ON readings`);
      await sequelize.query(
        'DROP FUNCTION logger_summaries_again, logger_summaries_written, logger_summaries_changed',
      );
    } else
      for (const trigger of ['add', 'correct', 'update', 'delete'])
        await sequelize.query(`DROP TRIGGER logger_summaries_${trigger}`);
    await sequelize.query('DROP TABLE logger_summaries');
    await sequelize.query('DROP INDEX readings_by_hand');
    await loggerSummaries.up(sequelize.getQueryInterface());
    assert.deepEqual((await bothWays(server, batchId)).kept, kept);
    const all = await rows(server, 'SELECT COUNT(*) AS count FROM logger_summaries', []);
    const grouped = await rows(
      server,
      `SELECT COUNT(*) AS count FROM (SELECT 1 FROM readings x WHERE x.source = 'logger'
         AND x.batch_id IS NOT NULL AND NOT EXISTS (SELECT 1 FROM readings c WHERE c.corrects_id = x.id)
       GROUP BY x.batch_id, x.control) g`,
      [],
    );
    assert.equal(all[0]!.count, grouped[0]!.count);
  });

  it('should sum a control up again when a reading is removed or changed by hand', async (t) => {
    const { server } = await startProcessServer(t);
    const lot = await recordControlled(server.as('rosa'));
    const batchId = await idOf(server, 'batches', lot);
    const [first, second] = await addReadings(server, [
      { batchId, control: 'hold', at: at(0), value: '2.5', source: 'logger' },
      { batchId, control: 'hold', at: at(1), value: '4.5', source: 'logger' },
    ]);
    const sequelize = server.context.db.sequelize;
    await sequelize.query(`UPDATE readings SET control = 'chill' WHERE id = ?`, {
      replacements: [second],
    });
    let { kept, summed } = await bothWays(server, batchId);
    assert.deepEqual(kept, summed);
    assert.deepEqual(
      kept.map((s) => [s.control, s.count, s.min]),
      [
        ['chill', 1, '4.5'],
        ['hold', 1, '2.5'],
      ],
    );
    await sequelize.query('DELETE FROM readings WHERE id = ?', { replacements: [first] });
    ({ kept, summed } = await bothWays(server, batchId));
    assert.deepEqual(kept, summed);
    assert.deepEqual(
      kept.map((s) => s.control),
      ['chill'],
    );
  });
});
