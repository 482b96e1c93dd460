import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { allowedMoves } from './batch-status.ts';

describe('allowedMoves', () => {
  it('should let a planned batch start or be discarded', () => {
    assert.deepEqual(
      allowedMoves('planned', 'cure').map((m) => m.to),
      ['in-progress', 'discarded'],
    );
  });

  it('should offer curing to a cure in progress, and not proofing', () => {
    assert.deepEqual(
      allowedMoves('in-progress', 'cure').map((m) => m.to),
      ['curing', 'done', 'discarded'],
    );
  });

  it('should offer proofing to a dough in progress, and not curing', () => {
    assert.deepEqual(
      allowedMoves('in-progress', 'dough').map((m) => m.to),
      ['proofing', 'done', 'discarded'],
    );
  });

  it('should offer neither hold to a blend or a mix', () => {
    assert.deepEqual(
      allowedMoves('in-progress', 'blend').map((m) => m.to),
      ['done', 'discarded'],
    );
  });

  it('should ask a reason only for discarding', () => {
    assert.deepEqual(
      allowedMoves('curing', 'cure').map((m) => [m.to, m.needsReason]),
      [
        ['done', false],
        ['discarded', true],
      ],
    );
  });

  it('should offer nothing once a batch is done or discarded', () => {
    assert.equal(allowedMoves('done', 'cure').length, 0);
    assert.equal(allowedMoves('discarded', 'dough').length, 0);
  });
});
