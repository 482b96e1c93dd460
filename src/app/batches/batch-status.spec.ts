import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { allowedMoves, offeredMoves, signOffBlocked } from './batch-status.ts';

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

describe('offeredMoves', () => {
  const on = { separateSignOff: true, lockSignedOff: true, cureBeforeDone: true };
  const off = { separateSignOff: false, lockSignedOff: false, cureBeforeDone: false };
  const cure = { kind: 'cure', status: 'in-progress', signedOff: null } as const;
  const signed = {
    kind: 'cure',
    status: 'curing',
    signedOff: { by: { id: 3, displayName: 'Imke' }, at: '2026-03-02T14:00:00Z' },
  } as const;
  const cook = { id: 2, role: 'cook' } as const;
  const admin = { id: 1, role: 'admin' } as const;
  const view = (moves: ReturnType<typeof offeredMoves>) =>
    moves.map((m) => [m.to, m.needsReason, m.blocked]);

  it('should hold a cure in progress back from done, saying why, while the rule is on', () => {
    assert.deepEqual(view(offeredMoves(cure, cook, on)), [
      ['curing', false, null],
      ['done', false, 'A cure is done only after curing; start curing first.'],
      ['discarded', true, null],
    ]);
    assert.equal(offeredMoves(cure, cook, off)[1].blocked, null);
  });

  it('should hold a cook back from every move of a signed-off batch, saying why', () => {
    const why = 'This batch is signed off; only an admin can change its status now, with a reason.';
    assert.deepEqual(view(offeredMoves(signed, cook, on)), [
      ['done', false, why],
      ['discarded', true, why],
    ]);
    assert.deepEqual(view(offeredMoves(signed, cook, off)), [
      ['done', false, null],
      ['discarded', true, null],
    ]);
  });

  it('should offer an admin every move of a signed-off batch, each asking a reason', () => {
    assert.deepEqual(view(offeredMoves(signed, admin, on)), [
      ['done', true, null],
      ['discarded', true, null],
    ]);
  });
});

describe('signOffBlocked', () => {
  const rules = { separateSignOff: true, lockSignedOff: true, cureBeforeDone: true };
  const batch = { operator: { id: 1, displayName: 'Rosa' } };

  it('should tell the person who recorded the batch that another person signs it off', () => {
    assert.equal(
      signOffBlocked(batch, { id: 1, role: 'admin' }, rules),
      'You recorded this batch; another person signs it off.',
    );
    assert.equal(signOffBlocked(batch, { id: 3, role: 'reviewer' }, rules), null);
    assert.equal(
      signOffBlocked(batch, { id: 1, role: 'admin' }, { ...rules, separateSignOff: false }),
      null,
    );
  });
});
