import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { BatchSummary } from '../batches/batch-types';
import { daysBetween, daysLeftWords, holdingBatches, isOverdue } from './days-left.ts';

const held = (lotCode: string, readyOn: string | null): BatchSummary =>
  ({ lotCode, readyOn }) as unknown as BatchSummary;

describe('daysBetween', () => {
  it('should count calendar days across a month end', () => {
    assert.equal(daysBetween('2026-11-29', '2026-12-02'), 3);
    assert.equal(daysBetween('2026-12-02', '2026-11-30'), -2);
    assert.equal(daysBetween('2026-12-02', '2026-12-02'), 0);
  });

  it('should not be thrown by a daylight-saving change', () => {
    assert.equal(daysBetween('2026-03-28', '2026-03-30'), 2);
  });
});

describe('holdingBatches', () => {
  it('should put overdue batches first, then by ready date, then those without one', () => {
    const order = holdingBatches(
      [
        held('A', '2026-12-05'),
        held('B', null),
        held('C', '2026-11-30'),
        held('D', '2026-12-02'),
        held('E', '2026-11-28'),
      ],
      '2026-12-02',
    );
    assert.deepEqual(
      order.map((h) => [h.batch.lotCode, h.daysLeft, h.overdue]),
      [
        ['E', -4, true],
        ['C', -2, true],
        ['D', 0, false],
        ['A', 3, false],
        ['B', null, false],
      ],
    );
  });
});

describe('daysLeftWords', () => {
  it('should say how long in words', () => {
    assert.equal(daysLeftWords(-1), 'Overdue by 1 day');
    assert.equal(daysLeftWords(-3), 'Overdue by 3 days');
    assert.equal(daysLeftWords(0), 'Ready today');
    assert.equal(daysLeftWords(1), '1 day left');
    assert.equal(daysLeftWords(6), '6 days left');
    assert.equal(daysLeftWords(null), 'No ready date');
  });
});

describe('isOverdue', () => {
  it('should count a batch overdue only while it is held after its ready day', () => {
    const batch = { status: 'curing' as const, readyOn: '2026-12-02' };
    assert.equal(isOverdue(batch, '2026-12-02'), false);
    assert.equal(isOverdue(batch, '2026-12-03'), true);
    assert.equal(isOverdue({ ...batch, status: 'done' }, '2026-12-03'), false);
    assert.equal(isOverdue({ ...batch, readyOn: null }, '2026-12-03'), false);
  });
});
