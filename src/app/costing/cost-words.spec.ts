import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { costSourceWords, unpricedWords } from './cost-words.ts';

describe('cost words', () => {
  it('should say where a price came from, or why there is none', () => {
    assert.equal(
      costSourceWords({ source: 'lot', lot: 'R261201-01', unpriced: null }),
      'lot R261201-01',
    );
    assert.equal(
      costSourceWords({ source: 'earlier-batch', lot: '261201-CG-01', unpriced: null }),
      'batch 261201-CG-01',
    );
    assert.equal(
      costSourceWords({ source: 'latest-price', lot: null, unpriced: null }),
      'latest price',
    );
    assert.equal(
      costSourceWords({
        source: 'latest-price',
        lot: null,
        unpriced: 'never received with a price',
      }),
      'never received with a price',
    );
  });

  it('should list the unpriced lines with their reasons, each reason once', () => {
    assert.equal(
      unpricedWords([
        { name: 'sea salt', reason: 'never received with a price' },
        { name: 'water', reason: 'stocked by volume, weighed in the batch' },
        { name: 'black pepper', reason: 'never received with a price' },
      ]),
      'sea salt, black pepper (never received with a price); water (stocked by volume, weighed in the batch)',
    );
  });
});
