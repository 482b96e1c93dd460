import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { doneRefusal, verifyRefusal, type ReleaseBatch } from './release-rules.ts';
import { SAFE_WORKFLOW_RULES } from './workflow-rules.ts';

const FINISHED: ReleaseBatch = {
  status: 'done',
  operatorId: 2,
  openDeviations: 0,
  openControls: [],
};
const REVIEWER = { id: 3 };

describe('hold and release', () => {
  it('holds a batch with an open deviation from being marked done', () => {
    assert.equal(doneRefusal(1)?.code, 'on-hold');
    assert.equal(doneRefusal(0), undefined);
  });

  it('releases a finished batch with nothing open, by someone other than its cook', () => {
    assert.equal(verifyRefusal(FINISHED, REVIEWER, SAFE_WORKFLOW_RULES), undefined);
  });

  it('refuses, in order: not finished, on hold, controls open, own batch', () => {
    const cases: [Partial<ReleaseBatch>, { id: number }, string][] = [
      [{ status: 'curing' }, REVIEWER, 'not-finished'],
      [{ openDeviations: 1 }, REVIEWER, 'on-hold'],
      [{ openControls: ['Chilling'] }, REVIEWER, 'controls-open'],
      [{}, { id: 2 }, 'own-batch'],
    ];
    for (const [batch, who, code] of cases)
      assert.equal(verifyRefusal({ ...FINISHED, ...batch }, who, SAFE_WORKFLOW_RULES)?.code, code);
    const open = verifyRefusal(
      { ...FINISHED, openControls: ['Chilling'] },
      REVIEWER,
      SAFE_WORKFLOW_RULES,
    );
    assert.match(open!.message, /Chilling/);
  });

  it('lets the cook release their own batch when the kitchen turned separate sign-off off', () => {
    const rules = { ...SAFE_WORKFLOW_RULES, separateSignOff: false };
    assert.equal(verifyRefusal(FINISHED, { id: 2 }, rules), undefined);
  });
});
