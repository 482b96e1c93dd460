import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import {
  DEFAULT_QUERY,
  apiFilterParams,
  csvHref,
  isFiltered,
  paramsFromQuery,
  queryFromParams,
} from './log-query.ts';

describe('queryFromParams', () => {
  it('should open the plain log when the address has no parameters', () => {
    assert.deepEqual(queryFromParams({}), DEFAULT_QUERY);
  });

  it('should read every filter, the sort and the page size', () => {
    const query = queryFromParams({
      formula: 'quillmoor-belly',
      kind: 'cure',
      status: 'curing,done',
      operator: '2',
      from: '2026-11-01',
      to: '2026-11-30',
      lot: '2611',
      show: 'sign-off',
      sort: 'ready',
      order: 'desc',
      size: '100',
    });
    assert.deepEqual(query, {
      formula: 'quillmoor-belly',
      kind: 'cure',
      statuses: ['curing', 'done'],
      operator: 2,
      from: '2026-11-01',
      to: '2026-11-30',
      lot: '2611',
      show: 'sign-off',
      sort: 'ready',
      order: 'desc',
      size: 100,
    });
  });

  it('should leave out what it cannot read instead of failing', () => {
    const query = queryFromParams({
      kind: 'soup',
      status: 'curing,cooking',
      operator: 'tobin',
      from: '1 Nov',
      lot: 'a b',
      show: 'everything',
      sort: 'colour',
      size: '30',
    });
    assert.deepEqual(query, { ...DEFAULT_QUERY, statuses: ['curing'] });
  });

  it('should open newest first by start day', () => {
    assert.deepEqual([DEFAULT_QUERY.sort, DEFAULT_QUERY.order], ['started', 'desc']);
  });

  it('should take the sort’s own order when none is given', () => {
    assert.equal(queryFromParams({ sort: 'lot' }).order, 'asc');
  });

  it('should upper-case a lot code prefix', () => {
    assert.equal(queryFromParams({ lot: '261201-qb' }).lot, '261201-QB');
  });
});

describe('paramsFromQuery', () => {
  it('should give the plain log a plain address', () => {
    assert.ok(Object.values(paramsFromQuery(DEFAULT_QUERY)).every((value) => value === null));
  });

  it('should survive a round trip through the address bar', () => {
    const query = {
      ...DEFAULT_QUERY,
      statuses: ['curing' as const],
      show: 'overdue' as const,
      sort: 'lot' as const,
      order: 'asc' as const,
      size: 50 as const,
    };
    const params = Object.fromEntries(
      Object.entries(paramsFromQuery(query)).filter(([, v]) => v !== null),
    ) as Record<string, string>;
    assert.deepEqual(queryFromParams(params), query);
  });
});

describe('apiFilterParams and csvHref', () => {
  it('should send the filters and sort but never a page size or cursor', () => {
    const query = {
      ...DEFAULT_QUERY,
      kind: 'cure' as const,
      statuses: ['curing' as const, 'proofing' as const],
      size: 100 as const,
    };
    assert.deepEqual(apiFilterParams(query, '2026-12-03'), {
      kind: 'cure',
      status: 'curing,proofing',
      sort: 'started',
      order: 'desc',
    });
    assert.equal(
      csvHref(query, '2026-12-03'),
      '/api/batches.csv?kind=cure&status=curing%2Cproofing&sort=started&order=desc',
    );
  });

  it('should ask the server for each quick filter, overdue counted from the day given', () => {
    const params = (show: 'sign-off' | 'failed' | 'overdue') =>
      apiFilterParams({ ...DEFAULT_QUERY, show }, '2026-12-03');
    assert.equal(params('sign-off')['needsSignOff'], 'true');
    assert.equal(params('failed')['checks'], 'failed');
    assert.equal(params('overdue')['overdueOn'], '2026-12-03');
    assert.equal(isFiltered({ ...DEFAULT_QUERY, show: 'failed' }), true);
  });
});

describe('isFiltered', () => {
  it('should not count the sort or the page size as a filter', () => {
    assert.equal(isFiltered({ ...DEFAULT_QUERY, sort: 'lot', size: 100 }), false);
    assert.equal(isFiltered({ ...DEFAULT_QUERY, lot: '26' }), true);
  });
});
