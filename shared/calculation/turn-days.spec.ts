import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { turnOwedSince } from './turn-days.ts';

// The demo belly at 4 cm: started Wed 2 Dec 2026, ready Thu 10 Dec, turned every 2 days
// (formulas/quillmoor-belly.yaml), so its turning days are Fri 4, Sun 6 and Tue 8 Dec, worked by
// hand: 2 + 2, 2 + 4, 2 + 6; 2 + 8 is the ready day. The rule that a missed turn stays owed until
// it is done, and that one turn settles every missed day: common practice, no source.
const BELLY = { start: '2026-12-02', ready: '2026-12-10', flipEveryDays: 2 };

describe('turnOwedSince', () => {
  it('should owe nothing before the first turning day', () => {
    assert.equal(turnOwedSince(BELLY, null, '2026-12-02'), null);
    assert.equal(turnOwedSince(BELLY, null, '2026-12-03'), null);
  });

  it('should owe a turn on a turning day until one is recorded that day', () => {
    assert.equal(turnOwedSince(BELLY, null, '2026-12-04'), '2026-12-04');
    assert.equal(turnOwedSince(BELLY, '2026-12-04', '2026-12-04'), null);
  });

  it('should keep a turn missed yesterday owed today, since its turning day', () => {
    assert.equal(turnOwedSince(BELLY, null, '2026-12-05'), '2026-12-04');
    assert.equal(turnOwedSince(BELLY, '2026-12-05', '2026-12-05'), null);
    assert.equal(turnOwedSince(BELLY, '2026-12-05', '2026-12-06'), '2026-12-06');
    assert.equal(turnOwedSince(BELLY, '2026-12-05', '2026-12-07'), '2026-12-06');
  });

  it('should not count a turn made before the turning day', () => {
    assert.equal(turnOwedSince(BELLY, '2026-12-03', '2026-12-04'), '2026-12-04');
  });

  it('should owe one turn, for the latest turning day, when several were missed', () => {
    assert.equal(turnOwedSince(BELLY, null, '2026-12-08'), '2026-12-08');
    assert.equal(turnOwedSince(BELLY, '2026-12-04', '2026-12-09'), '2026-12-08');
    assert.equal(turnOwedSince(BELLY, '2026-12-08', '2026-12-09'), null);
  });

  it('should owe no turn from the ready day on, nor for a cure with no turning rule', () => {
    assert.equal(turnOwedSince(BELLY, null, '2026-12-10'), null);
    assert.equal(turnOwedSince(BELLY, null, '2026-12-12'), null);
    assert.equal(turnOwedSince({ ...BELLY, flipEveryDays: null }, null, '2026-12-05'), null);
  });
});
