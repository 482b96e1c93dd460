import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import {
  KINDS_FOR,
  QUANTITY_KEYS as CORE_KEYS,
} from '../../../shared/calculation/plan/component-quantity.ts';
import {
  KINDS_FOR_KEY,
  QUANTITY_KEYS,
  quantityChoices,
  quantityKeyFor,
  takesSizes,
} from './assembly-quantity.ts';

describe('the quantity keys of an assembly part', () => {
  it('should be the core’s keys, each fitting the same kinds as in the core', () => {
    assert.deepEqual([...QUANTITY_KEYS].sort(), [...CORE_KEYS].sort());
    for (const key of CORE_KEYS) {
      assert.deepEqual([...KINDS_FOR_KEY[key]].sort(), [...KINDS_FOR[key]].sort(), key);
    }
  });

  it('should offer only the keys that fit the formula’s kind', () => {
    const keys = (kind: Parameters<typeof quantityChoices>[0]) =>
      quantityChoices(kind).map((choice) => choice.value);
    assert.deepEqual(keys('blend'), ['portions', 'amount', 'pct']);
    assert.deepEqual(keys('dough'), ['pieces', 'amount', 'pct']);
    assert.deepEqual(keys('cure'), ['slices', 'amount', 'pct']);
    assert.deepEqual(keys('mix'), ['amount', 'pct']);
    assert.deepEqual(keys('assembly'), ['units']);
    assert.deepEqual(keys(null), ['portions', 'pieces', 'slices', 'amount', 'units', 'pct']);
  });
});

describe('quantityKeyFor', () => {
  it('should keep a key that still fits the chosen formula', () => {
    assert.equal(quantityKeyFor('cure', 'amount'), 'amount');
    assert.equal(quantityKeyFor('blend', 'portions'), 'portions');
  });

  it('should take the kind’s own count when the key does not fit', () => {
    assert.equal(quantityKeyFor('blend', 'pieces'), 'portions');
    assert.equal(quantityKeyFor('dough', 'portions'), 'pieces');
    assert.equal(quantityKeyFor('cure', 'units'), 'slices');
    assert.equal(quantityKeyFor('assembly', 'amount'), 'units');
  });

  it('should give a mix its finished weight, and leave an unknown formula’s key alone', () => {
    assert.equal(quantityKeyFor('mix', 'portions'), 'amount');
    assert.equal(quantityKeyFor(null, 'pieces'), 'pieces');
  });
});

describe('takesSizes', () => {
  it('should ask a cure by slices or weight for its sizes, and nothing else', () => {
    assert.equal(takesSizes('cure', 'slices'), true);
    assert.equal(takesSizes('cure', 'amount'), true);
    assert.equal(takesSizes('blend', 'amount'), false);
    assert.equal(takesSizes(null, 'amount'), true);
    assert.equal(takesSizes(null, 'portions'), false);
  });
});
