import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { measureOf } from './trace-lots.ts';

describe('the measure a traced lot is shown in', () => {
  it('should show lots received by volume in millilitres, gallons among them', () => {
    // Migration 015: lots are kept in grams (g, kg, oz, lb), millilitres (ml, l, gal) or a count.
    assert.deepEqual(['kg', 'lb', 'l', 'gal', 'each'].map(measureOf), [
      'g',
      'g',
      'ml',
      'ml',
      'each',
    ]);
  });
});
