import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { BatchListItem } from '../batches/batch-types';
import { boardOf, turnOf } from './board-rows.ts';

const held = (
  lotCode: string,
  status: 'curing' | 'proofing',
  startedOn: string,
  readyOn: string | null,
  flipEveryDays: number | null = null,
): BatchListItem =>
  ({ lotCode, status, startedOn, readyOn, flipEveryDays, lastTurn: null }) as BatchListItem;

const TOBIN = { id: 3, displayName: 'Tobin Marrowfeld (cook)' };
/** The belly as the log lists it after a turn on `on`. */
const turned = (batch: BatchListItem, on: string): BatchListItem => ({
  ...batch,
  lastTurn: { on, at: `${on}T08:10:00.000Z`, by: TOBIN },
});

// The demo belly at 4 cm: 2 days per cm = 8 days, turned every 2 days (formulas/quillmoor-belly.yaml).
const BELLY = held('B', 'curing', '2026-12-02', '2026-12-10', 2);

// Its turning days, by hand: Fri 4, Sun 6 and Tue 8 Dec (start + 2, + 4, + 6; + 8 is the ready
// day). A missed turn stays owed until it is done: common practice, no source.
describe('turnOf', () => {
  it('should owe a turn on start + k × every, never on the start day or the ready day', () => {
    assert.equal(turnOf(BELLY, '2026-12-02').owedSince, null);
    assert.equal(turnOf(BELLY, '2026-12-03').owedSince, null);
    assert.equal(turnOf(BELLY, '2026-12-04').owedSince, '2026-12-04');
    assert.equal(turnOf(BELLY, '2026-12-08').owedSince, '2026-12-08');
    assert.equal(turnOf(BELLY, '2026-12-10').owedSince, null);
  });

  it('should keep a turn missed on Fri 4 Dec owed on Sat 5 Dec, until it is done', () => {
    assert.equal(turnOf(BELLY, '2026-12-05').owedSince, '2026-12-04');
    assert.deepEqual(turnOf(turned(BELLY, '2026-12-05'), '2026-12-05'), {
      owedSince: null,
      turnedToday: { on: '2026-12-05', at: '2026-12-05T08:10:00.000Z', by: TOBIN },
    });
  });

  it('should say a cure turned today is turned, and owe nothing more that day', () => {
    const today = turnOf(turned(BELLY, '2026-12-04'), '2026-12-04');
    assert.equal(today.owedSince, null);
    assert.equal(today.turnedToday?.by.displayName, 'Tobin Marrowfeld (cook)');
    // The next day it is no longer "turned today", and no turn is owed until Sun 6 Dec.
    assert.deepEqual(turnOf(turned(BELLY, '2026-12-04'), '2026-12-05'), {
      owedSince: null,
      turnedToday: null,
    });
    assert.equal(turnOf(turned(BELLY, '2026-12-04'), '2026-12-06').owedSince, '2026-12-06');
  });

  it('should not turn a cure whose formula gives no turning rule, nor a dough', () => {
    assert.equal(turnOf({ ...BELLY, flipEveryDays: null }, '2026-12-04').owedSince, null);
    assert.equal(turnOf({ ...BELLY, status: 'proofing' }, '2026-12-04').owedSince, null);
  });
});

describe('boardOf', () => {
  it('should put what is due today first — overdue, ready, a turn owed — and keep doughs apart', () => {
    const board = boardOf(
      [
        held('LATER', 'curing', '2026-12-01', '2026-12-20'),
        BELLY,
        turned(held('TURNED', 'curing', '2026-12-02', '2026-12-10', 2), '2026-12-04'),
        held('MISSED', 'curing', '2026-11-30', '2026-12-12', 3),
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
        ['MISSED', 'turn'],
        ['TURNED', null],
        ['LATER', null],
      ],
    );
    assert.deepEqual(
      board.proofing.map((r) => [r.batch.lotCode, r.due]),
      [['DOUGH', null]],
    );
  });
});
