import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import {
  SAFE_WORKFLOW_RULES,
  moveRefusal,
  signOffConcern,
  signOffNoteRefusal,
  signOffRefusal,
  type WorkflowRules,
} from './workflow-rules.ts';

const OFF: WorkflowRules = { separateSignOff: false, lockSignedOff: false, cureBeforeDone: false };
const ON = SAFE_WORKFLOW_RULES;

const belly = { kind: 'cure', status: 'in-progress', signedOff: false, operatorId: 7 } as const;
const cook = { id: 7, role: 'cook' } as const;
const admin = { id: 1, role: 'admin' } as const;

describe('the workflow rules', () => {
  it('should be on unless a kitchen turns them off', () => {
    assert.deepEqual(SAFE_WORKFLOW_RULES, {
      separateSignOff: true,
      lockSignedOff: true,
      cureBeforeDone: true,
    });
  });
});

describe('signOffRefusal', () => {
  it('should refuse the person who recorded the batch, with 403', () => {
    const refusal = signOffRefusal(belly, { id: 7 }, ON);
    assert.equal(refusal?.status, 403);
    assert.equal(refusal?.code, 'own-batch');
    assert.equal(refusal?.message, 'you recorded this batch; another person signs it off');
  });

  it('should let anyone else sign off, and the recorder too when the rule is off', () => {
    assert.equal(signOffRefusal(belly, { id: 8 }, ON), undefined);
    assert.equal(signOffRefusal(belly, { id: 7 }, OFF), undefined);
  });
});

describe('signOffNoteRefusal', () => {
  const failed = { status: 'done', failedChecks: ['Ingoing sodium nitrite'] } as const;

  it('should ask a note naming the failed check, with 400', () => {
    const refusal = signOffNoteRefusal(failed, null);
    assert.equal(refusal?.status, 400);
    assert.equal(refusal?.code, 'note-needed');
    assert.equal(
      refusal?.message,
      'the check “Ingoing sodium nitrite” failed; say in the note what you checked before signing it off',
    );
  });

  it('should ask a note for a batch still curing, and name both concerns together', () => {
    assert.equal(signOffConcern({ status: 'curing', failedChecks: [] }), 'it is still curing');
    assert.equal(
      signOffConcern({ status: 'curing', failedChecks: ['Salt', 'Sugar', 'Ascorbate'] }),
      'the checks “Salt”, “Sugar” and “Ascorbate” failed, and it is still curing',
    );
    assert.equal(
      signOffNoteRefusal({ status: 'curing', failedChecks: [] }, '  ')?.code,
      'note-needed',
    );
  });

  it('should take a note, and ask none of a batch that passed and is done', () => {
    assert.equal(signOffNoteRefusal(failed, 'Re-weighed the cure: 118 ppm stands'), undefined);
    assert.equal(signOffNoteRefusal({ status: 'done', failedChecks: [] }, null), undefined);
    assert.equal(signOffNoteRefusal({ status: 'in-progress', failedChecks: [] }, null), undefined);
  });
});

describe('moveRefusal', () => {
  const signed = { ...belly, status: 'curing', signedOff: true } as const;

  it('should refuse a cook moving a signed-off batch, with 403', () => {
    for (const to of ['done', 'discarded'] as const) {
      const refusal = moveRefusal(signed, to, { ...cook, reason: 'the probe said so' }, ON);
      assert.equal(refusal?.status, 403, to);
      assert.equal(refusal?.code, 'signed-off');
    }
  });

  it('should ask an admin for a reason to move a signed-off batch, with 400', () => {
    for (const reason of [null, '', '   ']) {
      const refusal = moveRefusal(signed, 'done', { ...admin, reason }, ON);
      assert.equal(refusal?.status, 400, JSON.stringify(reason));
      assert.equal(refusal?.code, 'reason-needed');
    }
  });

  it('should let an admin with a reason move a signed-off batch', () => {
    assert.equal(moveRefusal(signed, 'done', { ...admin, reason: 'cure checked' }, ON), undefined);
  });

  it('should let anyone move a signed-off batch when the lock is off', () => {
    assert.equal(moveRefusal(signed, 'done', { ...cook, reason: null }, OFF), undefined);
  });

  it('should refuse a cure going from in progress straight to done, with 409', () => {
    const refusal = moveRefusal(belly, 'done', { ...admin, reason: null }, ON);
    assert.equal(refusal?.status, 409);
    assert.equal(refusal?.code, 'not-cured');
    assert.match(refusal?.message ?? '', /curing first/);
  });

  it('should let a cure reach done through curing, and other kinds go straight to done', () => {
    assert.equal(
      moveRefusal({ ...belly, status: 'curing' }, 'done', { ...cook, reason: null }, ON),
      undefined,
    );
    for (const kind of ['dough', 'blend', 'mix'] as const)
      assert.equal(
        moveRefusal({ ...belly, kind }, 'done', { ...cook, reason: null }, ON),
        undefined,
      );
  });

  it('should let a cure go straight to done when the rule is off', () => {
    assert.equal(moveRefusal(belly, 'done', { ...cook, reason: null }, OFF), undefined);
  });

  it('should say the lock before the curing rule on a signed-off cure in progress', () => {
    const refusal = moveRefusal(
      { ...belly, signedOff: true },
      'done',
      { ...cook, reason: 'x' },
      ON,
    );
    assert.equal(refusal?.code, 'signed-off');
  });
});
