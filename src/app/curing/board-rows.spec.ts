import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { BatchListItem } from '../batches/batch-types';
import { boardOf, turnsToday } from './board-rows.ts';

const held = (
  lotCode: string,
  status: 'curing' | 'proofing',
  startedOn: string,
  readyOn: string | null,
  flipEveryDays: number | null = null,
): BatchListItem => ({ lotCode, status, startedOn, readyOn, flipEveryDays }) as BatchListItem;

// The demo belly at 4 cm: 2 days per cm = 8 days, turned every 2 days (formulas/quillmoor-belly.yaml).
const BELLY = held('B', 'curing', '2026-12-02', '2026-12-10', 2);

describe('turnsToday', () => {
  it('should turn on start + k × every, never on the start day or the ready day', () => {
    assert.equal(turnsToday(BELLY, '2026-12-02'), false);
    assert.equal(turnsToday(BELLY, '2026-12-03'), false);
    assert.equal(turnsToday(BELLY, '2026-12-04'), true);
    assert.equal(turnsToday(BELLY, '2026-12-08'), true);
    assert.equal(turnsToday(BELLY, '2026-12-10'), false);
  });

  it('should not turn a cure whose formula gives no turning rule', () => {
    assert.equal(turnsToday({ ...BELLY, flipEveryDays: null }, '2026-12-04'), false);
  });
});

describe('boardOf', () => {
  it('should put what is due today first — overdue, ready, to turn — and keep doughs apart', () => {
    const board = boardOf(
      [
        held('LATER', 'curing', '2026-12-01', '2026-12-20'),
        BELLY,
        held('READY', 'curing', '2026-11-25', '2026-12-04'),
        held('LATE', 'curing', '2026-11-20', '2026-12-01'),
        held('DOUGH', 'proofing', '2026-12-04', null),
      ],
      '2026-12-04',
    );
    assert.deepEqual(
      board.curing.map((r) => [r.batch.lotCode, r.due]),
      [
        ['LATE', 'overdue'],
        ['READY', 'ready'],
        ['B', 'turn'],
        ['LATER', null],
      ],
    );
    assert.deepEqual(
      board.proofing.map((r) => [r.batch.lotCode, r.due]),
      [['DOUGH', null]],
    );
  });
});
