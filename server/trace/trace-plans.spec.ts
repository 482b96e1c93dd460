import assert from 'node:assert/strict';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { after, before, describe, it } from 'node:test';
import { openDatabase, type Database } from '../db/database.ts';
import { TRACE_STATEMENTS, fullScans, planOf } from './trace-plans.ts';

// A recall must answer in under a second at a million batches and five million lot uses: that
// holds only while every step of a walk is an index lookup. A lost or unusable index turns a step
// into a read of the whole table, which this catches at any size (bench/recall.ts times it).
describe('the query plans of trace and recall', () => {
  let dir: string;
  let db: Database;
  before(async () => {
    dir = mkdtempSync(path.join(tmpdir(), 'larder-trace-plans-'));
    db = await openDatabase(path.join(dir, 'larderbook.sqlite'));
  });
  after(async () => {
    await db.close();
    rmSync(dir, { recursive: true, force: true });
  });

  for (const statement of TRACE_STATEMENTS) {
    it(`should look up ${statement.name} through ${statement.indexes.join(' and ')}, reading no table whole`, async () => {
      const plan = await planOf(db.sequelize, statement);
      assert.deepEqual(fullScans(plan), [], plan.join(' | '));
      for (const index of statement.indexes)
        assert.ok(
          plan.some((line) => line.startsWith('SEARCH') && line.includes(index)),
          `${index} in ${plan.join(' | ')}`,
        );
    });
  }

  it('should count a read of a whole table of the records as a full scan', () => {
    assert.deepEqual(
      fullScans([
        'SCAN u',
        'SCAN lot_uses',
        'SEARCH u USING INDEX lot_uses_batch (batch_id=?)',
        'SCAN rj VIRTUAL TABLE INDEX 1:',
        'SCAN walk',
      ]),
      ['SCAN u', 'SCAN lot_uses'],
    );
  });

  it('should see a lost index as a full scan', async () => {
    await db.sequelize.query('DROP INDEX lot_uses_source');
    const forward = TRACE_STATEMENTS.find((s) => s.name === 'trace forward');
    assert.ok(forward);
    const plan = await planOf(db.sequelize, forward);
    assert.notDeepEqual(fullScans(plan), [], plan.join(' | '));
  });
});
