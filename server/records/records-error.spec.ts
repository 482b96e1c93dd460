import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { AppError } from '../http/app-error.ts';
import { FAILURE_STATUS, appErrorOf } from '../http/failure-status.ts';
import { RetryLaterError } from '../http/retry-later.ts';
import { RecordsError, recordsErrorOf } from './records-error.ts';

describe('record keeping failures and the API', () => {
  it('should answer each kind of failure with the status the API always gave it', () => {
    // source: the API's statuses as tests/api pins them (400, 403, 404, 409, 422)
    assert.deepEqual(FAILURE_STATUS, {
      'bad-input': 400,
      forbidden: 403,
      'not-found': 404,
      conflict: 409,
      refused: 422,
    });
  });

  it('should keep status, code, words and details through record keeping and back', () => {
    for (const status of [400, 403, 404, 409, 422]) {
      const original = new AppError(status, 'some-code', 'some words', [{ at: 'x' }]);
      const inside = recordsErrorOf(original);
      assert.ok(inside instanceof RecordsError);
      const answered = appErrorOf(inside);
      assert.deepEqual(
        [answered.status, answered.code, answered.message, answered.details],
        [status, 'some-code', 'some words', [{ at: 'x' }]],
      );
    }
  });

  it('should leave a wait to retry after, and any other fault, as it is', () => {
    const wait = new RetryLaterError(503, 'busy', 'busy', 5);
    assert.equal(recordsErrorOf(wait), wait);
    const gone = new AppError(410, 'gone', 'gone');
    assert.equal(recordsErrorOf(gone), gone);
    const bug = new TypeError('x is undefined');
    assert.equal(recordsErrorOf(bug), bug);
  });
});
