import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Equipment } from './equipment-types';
import { standingOf } from './equipment-words';

const COOLER: Equipment = {
  id: 1,
  name: 'Walk-in cooler',
  kind: 'cooler',
  control: { rule: 'cold-holding', every: '4 h' },
  limitWords: '',
  active: true,
  createdAt: '2026-12-01T08:00:00.000Z',
  lastReading: {
    id: 1,
    at: '2026-12-03T08:00:00.000Z',
    value: '3.5',
    enteredAs: null,
    by: null,
    recordedAt: '2026-12-03T08:00:00.000Z',
    deviationId: null,
  },
  lastCalibration: null,
  state: { status: 'in-progress', summary: '', stage: null, nextDue: null, misses: [] },
  nextDue: '2026-12-03T12:00:00.000Z',
  overdue: false,
};

describe('equipment words', () => {
  it('should put out of limit before overdue, and overdue before within', () => {
    const missed = {
      ...COOLER,
      overdue: true,
      state: { ...COOLER.state!, status: 'missed' as const },
    };
    assert.equal(standingOf(missed).words, 'Out of limit');
    assert.equal(standingOf({ ...COOLER, overdue: true }).words, 'Reading overdue');
    assert.equal(standingOf(COOLER).words, 'Within limit');
    assert.equal(standingOf({ ...COOLER, active: false }).words, 'Retired');
  });
});
