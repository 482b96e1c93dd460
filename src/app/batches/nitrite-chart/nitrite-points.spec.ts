import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { BatchListItem } from '../batch-types';
import { axisDayWords, nitritePoints, nitriteSummary } from './nitrite-points.ts';

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

describe('axisDayWords', () => {
  const at = (day: string): number => Date.parse(`${day}T00:00:00Z`);

  it('should label the time axis with short days, as the product writes them', () => {
    assert.equal(axisDayWords(at('2026-11-08'), at('2026-11-01'), at('2026-12-03')), '8 Nov');
    // A tick between midnights is the day it falls in.
    assert.equal(
      axisDayWords(at('2026-09-30') + 3_600_000, at('2026-09-01'), at('2026-10-01')),
      '30 Sep',
    );
  });

  it('should give the year when the axis runs over New Year', () => {
    const [min, max] = [at('2026-12-20'), at('2027-01-10')];
    assert.equal(axisDayWords(at('2026-12-28'), min, max), '28 Dec 2026');
    assert.equal(axisDayWords(at('2027-01-04'), min, max), '4 Jan 2027');
  });
});
