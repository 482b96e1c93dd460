import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { ApiError } from '../core/api/api-error.ts';
import { refusalOf } from './plan-refusal.ts';

describe('refusalOf', () => {
  it('should name the reason and the formula of a refused plan', () => {
    const error = new ApiError(
      422,
      'plan-refused',
      'quillmoor-belly would have to start on 2026-12-01, before today (2026-12-02)',
      [{ reason: 'past-start', formula: 'quillmoor-belly', formulaProblem: false }],
    );
    assert.deepEqual(refusalOf(error), {
      title: 'This plan cannot be made.',
      message: 'quillmoor-belly would have to start on 2026-12-01, before today (2026-12-02).',
      reason: 'A batch would have to start before today: choose a later service day.',
      formula: 'quillmoor-belly',
      formulaProblem: false,
      critical: false,
    });
  });

  it('should say a batch over a critical limit must not be made', () => {
    const error = new ApiError(422, 'critical-limit', 'maple-pump-belly exceeds 120 ppm', [
      { reason: 'critical-limit', formula: 'maple-pump-belly', formulaProblem: false },
    ]);
    const view = refusalOf(error);
    assert.equal(view.critical, true);
    assert.match(view.title, /^Refused: .*critical limit/);
    assert.equal(view.formula, 'maple-pump-belly');
  });

  it('should send a formula’s own fault to Formulas', () => {
    const missing = refusalOf(
      new ApiError(422, 'plan-refused', 'no formula "chuck-grnd"', [
        { reason: 'missing-formula', formula: 'chuck-grnd', formulaProblem: true },
      ]),
    );
    assert.equal(missing.formulaProblem, true);
    assert.match(missing.reason ?? '', /not in the library/);
    const batch = refusalOf(new ApiError(422, 'not-an-assembly', 'pit-bun is a dough'));
    assert.equal(batch.formulaProblem, true);
    assert.equal(batch.reason, null);
  });

  it('should read a bad request, or a reason it does not know, in the server’s words only', () => {
    const view = refusalOf(
      new ApiError(400, 'bad-request', 'count must be at most 100000', [{ field: 'count' }]),
    );
    assert.equal(view.message, 'count must be at most 100000.');
    assert.equal(view.reason, null);
    assert.equal(view.formula, null);
    assert.equal(
      refusalOf(new ApiError(422, 'plan-refused', 'odd', [{ reason: 'new-reason' }])).reason,
      null,
    );
  });

  it('should not show a failure that is not the API’s as a refusal of the plan', () => {
    const view = refusalOf(new TypeError('x is undefined'));
    assert.equal(view.title, 'The plan could not be worked out.');
    assert.equal(view.critical, false);
  });
});
