import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { recallUrl, searchFromParams } from './trace-search.ts';

const params = (query: string) => new URLSearchParams(query);

describe('a trace search in the address', () => {
  it('should read a lot, or a supplier lot with its supplier, and nothing from an empty address', () => {
    assert.deepEqual(searchFromParams(params('lot=%20R261203-01%20')), { lot: 'R261203-01' });
    assert.deepEqual(searchFromParams(params('supplierLot=4471&supplier=Hollin+Farm')), {
      supplierLot: '4471',
      supplier: 'Hollin Farm',
    });
    assert.deepEqual(searchFromParams(params('supplierLot=4471&supplier=')), {
      supplierLot: '4471',
    });
    assert.equal(searchFromParams(params('')), null);
  });

  it('should download the recall report of the same search', () => {
    assert.equal(
      recallUrl('pdf', { supplierLot: '4471', supplier: 'Hollin Farm' }),
      '/api/trace/recall.pdf?supplierLot=4471&supplier=Hollin+Farm',
    );
  });
});
