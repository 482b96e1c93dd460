import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { lastThirtyDays, periodProblem, reportUrl } from './report-period.ts';

describe('the HACCP report period in the console', () => {
  it('should offer the last 30 days, today included, across a month end', () => {
    // 30 days ending 3 Dec 2026 begin on 4 Nov (November has 30 days).
    assert.deepEqual(lastThirtyDays(new Date(2026, 11, 3, 9)), {
      from: '2026-11-04',
      to: '2026-12-03',
    });
  });

  it('should refuse a period that ends before it begins, or lacks a day', () => {
    assert.equal(
      periodProblem({ from: '2026-12-02', to: '2026-12-01' }),
      'The last day comes before the first.',
    );
    assert.equal(
      periodProblem({ from: '', to: '2026-12-01' }),
      'Choose the first and the last day.',
    );
    assert.equal(periodProblem({ from: '2026-12-01', to: '2026-12-01' }), null);
  });

  it('should ask the API for the period in the format chosen', () => {
    assert.equal(
      reportUrl('pdf', { from: '2026-11-01', to: '2026-11-30' }),
      '/api/reports/haccp.pdf?from=2026-11-01&to=2026-11-30',
    );
  });
});
