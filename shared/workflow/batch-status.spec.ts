import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { recordedStatus } from './batch-status.ts';

const TODAY = '2026-12-03';

describe('recordedStatus', () => {
  it('should record an assembly done on its day and planned for a later one, unless told', () => {
    assert.deepEqual(recordedStatus('assembly', undefined, TODAY, TODAY), { status: 'done' });
    assert.deepEqual(recordedStatus('assembly', undefined, '2026-12-01', TODAY), {
      status: 'done',
    });
    assert.deepEqual(recordedStatus('assembly', undefined, '2026-12-04', TODAY), {
      status: 'planned',
    });
    assert.deepEqual(recordedStatus('assembly', 'planned', TODAY, TODAY), { status: 'planned' });
    assert.deepEqual(recordedStatus('assembly', 'in-progress', TODAY, TODAY), {
      status: 'in-progress',
    });
    assert.match(
      (recordedStatus('assembly', 'done', '2026-12-04', TODAY) as { refusal: string }).refusal,
      /not made yet: record it as planned/,
    );
  });

  it('should record any other batch in progress or planned, never done at once', () => {
    for (const kind of ['cure', 'dough', 'blend', 'mix'] as const) {
      assert.deepEqual(recordedStatus(kind, undefined, TODAY, TODAY), { status: 'in-progress' });
      assert.deepEqual(recordedStatus(kind, 'planned', TODAY, TODAY), { status: 'planned' });
      assert.match(
        (recordedStatus(kind, 'done', TODAY, TODAY) as { refusal: string }).refusal,
        /only an assembly is recorded as done/,
      );
    }
  });
});
