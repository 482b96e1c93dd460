import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import formulaSchema from '../schema/formula.schema.json' with { type: 'json' };
import { FORMULA_ID_PATTERN, isFormulaId } from './formula-id.ts';

describe('formula id', () => {
  it('should be the pattern the formula schema gives an id', () => {
    assert.equal(formulaSchema.$defs.id.pattern, FORMULA_ID_PATTERN);
  });

  it('should take lower-case letters, digits and dashes, 2 to 63 characters', () => {
    assert.equal(isFormulaId('quillmoor-belly'), true);
    assert.equal(isFormulaId('b2'), true);
    assert.equal(isFormulaId('x'.repeat(63)), true);
  });

  it('should refuse capitals, a leading dash, one character, 64 characters and non-strings', () => {
    for (const value of ['Belly', '-belly', 'b', 'x'.repeat(64), 'belly/../x', 'belly\n', 42, null])
      assert.equal(isFormulaId(value), false, String(value));
  });
});
