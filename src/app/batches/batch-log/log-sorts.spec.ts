import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { DEFAULT_ORDER, DEFAULT_QUERY, filterCount, queryFromParams } from './log-query.ts';
import { SORT_CHOICES, sortOfValue, sortValueOf } from './log-sorts.ts';

describe('the sort select of the stacked log', () => {
  it('should offer every sort the API takes, both ways, each once', () => {
    const offered = SORT_CHOICES.map(sortValueOf);
    assert.equal(new Set(offered).size, offered.length);
    for (const sort of Object.keys(DEFAULT_ORDER))
      for (const order of ['asc', 'desc'])
        assert.ok(offered.includes(`${sort} ${order}`), `${sort} ${order}`);
  });

  it('should open on the log’s own order, newest started first', () => {
    assert.equal(sortValueOf(DEFAULT_QUERY), sortValueOf(SORT_CHOICES[0]));
    assert.equal(SORT_CHOICES[0].words, 'Newest first');
  });

  it('should read back the sort of a chosen value, and nothing for one not offered', () => {
    assert.deepEqual(sortOfValue('ready asc'), { sort: 'ready', order: 'asc' });
    assert.deepEqual(sortOfValue('lot desc'), { sort: 'lot', order: 'desc' });
    assert.equal(sortOfValue('weight desc'), null);
    assert.equal(sortOfValue(''), null);
  });
});

describe('filterCount', () => {
  it('should count the filter boxes in use, dates as one, and not the quick filter', () => {
    assert.equal(filterCount(DEFAULT_QUERY), 0);
    const query = queryFromParams({
      formula: 'quillmoor-belly',
      status: 'curing,done',
      from: '2026-11-01',
      to: '2026-11-30',
      show: 'overdue',
    });
    assert.equal(filterCount(query), 3);
    assert.equal(filterCount(queryFromParams({ to: '2026-11-30', lot: '2611' })), 2);
  });
});
