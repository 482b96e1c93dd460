import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { BatchListItem } from '../batch-types';
import { nitritePoints, nitriteSummary } from './nitrite-points.ts';

/** A cure batch as the list gives it, with just what the chart reads. */
function cure(
  lot: string,
  recordedAt: string,
  ppm: string | null,
  limit = '200 ppm',
): BatchListItem {
  return {
    lotCode: lot,
    recordedAt,
    nitritePpm: ppm,
    nitriteMax:
      ppm === null ? null : { limit, status: Number(ppm) > parseFloat(limit) ? 'fail' : 'pass' },
  } as unknown as BatchListItem;
}

describe('nitritePoints', () => {
  it('should take each batch’s ppm and the ceiling of its own check', () => {
    const points = nitritePoints([
      cure('261101-QB-01', '2026-11-01T08:00:00.000Z', '156.25'),
      cure('261108-QB-01', '2026-11-08T08:00:00.000Z', '149.96'),
    ]);
    assert.deepEqual(
      points.map((p) => [p.lot, p.day, p.ppm, p.ppmText, p.limit, p.over]),
      [
        ['261101-QB-01', '2026-11-01', 156.25, '156.3 ppm', 200, false],
        ['261108-QB-01', '2026-11-08', 149.96, '150.0 ppm', 200, false],
      ],
    );
  });

  it('should leave out batches without a nitrite figure', () => {
    assert.equal(nitritePoints([cure('261101-QB-01', '2026-11-01T08:00:00Z', null)]).length, 0);
  });
});

describe('nitriteSummary', () => {
  it('should say the range, the limit and that none went over', () => {
    const points = nitritePoints([
      cure('261101-QB-01', '2026-11-01T08:00:00.000Z', '156.25'),
      cure('261108-QB-01', '2026-11-08T08:00:00.000Z', '118'),
    ]);
    assert.equal(
      nitriteSummary(points, 'Quillmoor belly'),
      'Ingoing nitrite of Quillmoor belly, 2 batches from 1 Nov 2026 to 8 Nov 2026: 118.0 to 156.3 ppm; limit 200 ppm; none over the limit.',
    );
  });

  it('should say so when there is nothing to draw', () => {
    assert.equal(nitriteSummary([], 'Ham'), 'No recorded batches of Ham yet.');
  });
});
