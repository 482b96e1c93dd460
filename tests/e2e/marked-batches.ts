import assert from 'node:assert/strict';
import { addDays } from '../../shared/calculation/dates.ts';
import type { TestServer } from '../helpers/test-server.ts';

/** Two batches the log must mark: one held past its ready day, one with a failed check. */
export interface MarkedBatches {
  readonly lateLot: string;
  readonly failedLot: string;
}

/**
 * Records a belly started ten days ago and still curing (8 days to ready,
 * formulas/quillmoor-belly.yaml), so overdue; and a grind whose check failed without refusing it
 * (a fat standard is labelling), the column the log reads set as such a recording sets it.
 */
export async function recordMarkedBatches(server: TestServer): Promise<MarkedBatches> {
  const today = new Date().toLocaleDateString('en-CA');
  const late = await server.as('tobin').post('/api/batches', {
    formula: 'quillmoor-belly',
    batch: { meat: '4.26kg', thickness: '4cm', start: addDays(today, -10) },
  });
  assert.equal(late.status, 201, late.text);
  const lateLot = late.json.batch.lotCode as string;
  const moved = await server.as('tobin').post(`/api/batches/${lateLot}/status`, { to: 'curing' });
  assert.equal(moved.status, 200, moved.text);
  const failed = await server.as('rosa').post('/api/batches', {
    formula: 'chuck-grind',
    batch: { total: '20kg' },
  });
  assert.equal(failed.status, 201, failed.text);
  const failedLot = failed.json.batch.lotCode as string;
  await server.context.db.sequelize.query(
    'UPDATE batches SET checks_passed = 0 WHERE lot_code = ?',
    { replacements: [failedLot] },
  );
  return { lateLot, failedLot };
}
