import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { LOT_CODE_PATTERN, formulaInitials, lotCode, lotPrefix, prefixRange } from './lot-code.ts';

describe('lot codes', () => {
  it('should take the initials of the formula id’s words', () => {
    assert.equal(formulaInitials('quillmoor-belly'), 'QB');
    assert.equal(formulaInitials('hot-link-cure'), 'HLC');
    assert.equal(formulaInitials('a-very-long-formula-name'), 'AVLF');
  });

  it('should give a one-word id two characters', () => {
    assert.equal(formulaInitials('bacon'), 'BA');
    assert.equal(formulaInitials('x1'), 'X1');
  });

  it('should build YYMMDD-XX-NN from the start date and a two-digit sequence', () => {
    const prefix = lotPrefix('2026-12-02', 'quillmoor-belly');
    assert.equal(prefix, '261202-QB-');
    assert.equal(lotCode(prefix, 1), '261202-QB-01');
    assert.equal(lotCode(prefix, 100), '261202-QB-100');
    assert.match(lotCode(prefix, 7), LOT_CODE_PATTERN);
  });

  it('should turn a prefix into the half-open range of codes that start with it', () => {
    assert.deepEqual(prefixRange('261202-QB'), ['261202-QB', '261202-QC']);
    assert.deepEqual(prefixRange('261202-QB-'), ['261202-QB-', '261202-QB.']);
    const [low, high] = prefixRange('2612');
    for (const code of ['261202-QB-01', '261231-HLC-99'])
      assert.ok(code >= low && code < high, code);
    assert.ok(!('261301-QB-01' >= low && '261301-QB-01' < high));
  });
});
