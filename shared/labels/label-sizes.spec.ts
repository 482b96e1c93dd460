import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import {
  LABEL_SIZES,
  SHI_WORDS_LEAST_SQUARE_INCHES,
  holdsSafeHandling,
  labelSizeRefusal,
} from './label-sizes.ts';

describe('which label sizes hold the safe handling instructions', () => {
  // The words need 3.57 square inches at 1/16 in lettering (label-sizes.ts works it; the figure
  // is measured again from the font in tests/pdf/label-fit.spec.ts). A 4 × 6 in label has
  // 24 square inches; a 2 × 1 in label, alone or as a sheet's cell, has 2.
  // source: 9 CFR 381.125(b)(1)(i), "lettering no smaller than one-sixteenth of an inch" (read)
  it('should find room on the 4 × 6 label only', () => {
    assert.ok(4 * 6 >= SHI_WORDS_LEAST_SQUARE_INCHES);
    assert.ok(2 * 1 < SHI_WORDS_LEAST_SQUARE_INCHES);
    assert.deepEqual(
      LABEL_SIZES.map((size) => [size, holdsSafeHandling(size)]),
      [
        ['4x6', true],
        ['2x1', false],
        ['letter', false],
        ['a4', false],
      ],
    );
  });

  it('should refuse the small sizes for a product that must carry the instructions, saying why', () => {
    assert.equal(labelSizeRefusal('4x6', true), undefined);
    assert.match(
      labelSizeRefusal('2x1', true) ?? '',
      /^A 2 × 1 in label is too small for the safe handling instructions this raw or not-ready-to-eat product must carry: print the 4 × 6 in label$/,
    );
    assert.match(
      labelSizeRefusal('letter', true) ?? '',
      /^The 2 × 1 in labels of a letter sheet are too small/,
    );
    assert.match(
      labelSizeRefusal('a4', true) ?? '',
      /^The 2 × 1 in labels of an A4 sheet are too small/,
    );
  });

  it('should not send the cook to the 4 × 6 label when that cannot hold the label either', () => {
    assert.match(labelSizeRefusal('2x1', true, false) ?? '', /must carry$/);
  });

  it('should print every size for a product that need not carry them', () => {
    for (const size of LABEL_SIZES) assert.equal(labelSizeRefusal(size, false), undefined);
  });
});
