import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { beforeServiceWords, scheduleOf } from './plan-schedule-days.ts';
import type { PresentedPlan, PresentedPlanBatch } from './plan-types';

const batch = (id: string, start: string): PresentedPlanBatch =>
  ({ formula: { id, title: id, kind: 'mix' }, start, ready: start }) as PresentedPlanBatch;

// The smokehouse burger for 2026-12-18, as `larder plan` lays it out: the belly 9 days ahead
// (8 days' hold + 1 lead day), the bun the day before, the grind and sauce on the day.
const PLAN = {
  serviceDate: '2026-12-18',
  days: [
    { date: '2026-12-09', formulas: ['quillmoor-belly'] },
    { date: '2026-12-17', formulas: ['pit-bun'] },
    { date: '2026-12-18', formulas: ['house-sauce', 'chuck-grind'] },
  ],
  batches: [
    batch('quillmoor-belly', '2026-12-09'),
    batch('pit-bun', '2026-12-17'),
    batch('house-sauce', '2026-12-18'),
    batch('chuck-grind', '2026-12-18'),
  ],
} as unknown as PresentedPlan;

describe('scheduleOf', () => {
  it('should give each start day its batches and how long before service it is', () => {
    assert.deepEqual(
      scheduleOf(PLAN).map((day) => [
        day.date,
        day.beforeService,
        day.batches.map((b) => b.formula.id),
      ]),
      [
        ['2026-12-09', 9, ['quillmoor-belly']],
        ['2026-12-17', 1, ['pit-bun']],
        ['2026-12-18', 0, ['house-sauce', 'chuck-grind']],
      ],
    );
  });

  it('should never leave a batch off the schedule', () => {
    const plan = {
      ...PLAN,
      days: PLAN.days.slice(1),
    } as PresentedPlan;
    assert.deepEqual(
      scheduleOf(plan).flatMap((day) => day.batches.map((b) => b.formula.id)),
      ['quillmoor-belly', 'pit-bun', 'house-sauce', 'chuck-grind'],
    );
  });
});

describe('beforeServiceWords', () => {
  it('should say how far a day is from service', () => {
    assert.equal(beforeServiceWords(0), 'On the day of service');
    assert.equal(beforeServiceWords(1), '1 day before service');
    assert.equal(beforeServiceWords(9), '9 days before service');
  });
});
