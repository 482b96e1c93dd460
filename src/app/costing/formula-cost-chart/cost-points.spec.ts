import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { costPoints, costSummary } from './cost-points.ts';

const point = (lot: string, day: string, perKg: string | null, complete = true) => ({
  lot,
  day,
  perFinishedKg: perKg,
  perFinishedKgText: perKg === null ? null : Number(perKg).toFixed(2),
  complete,
});

describe('cost points', () => {
  it('should leave out batches that finished at nothing and sum up the rest', () => {
    const points = costPoints([
      point('261101-QB-01', '2026-11-01', '10.786'),
      point('261110-QB-01', '2026-11-10', null),
      point('261120-QB-01', '2026-11-20', '11.5', false),
      point('261201-QB-01', '2026-12-01', '9.9'),
    ]);
    assert.deepEqual(
      points.map((p) => p.lot),
      ['261101-QB-01', '261120-QB-01', '261201-QB-01'],
    );
    assert.equal(
      costSummary(points),
      '3 batches from 1 Nov 2026 to 1 Dec 2026: 9.90 to 11.50 a finished kg, the latest 9.90. 1 batch is priced in part only.',
    );
    assert.equal(costSummary([]), 'No batches of this formula have a cost yet.');
  });
});
