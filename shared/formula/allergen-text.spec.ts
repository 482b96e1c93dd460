import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { allergenText, allergensFromText } from './allergen-text.ts';

// source: 21 U.S.C. 321(qq)(1) names ("Crustacean shellfish", "tree nuts", "soybeans") and
// 343(w)(2) (the species of fish or crustacean, the type of tree nut, named on the label)
describe('an ingredient’s allergens as one line of text', () => {
  it('should write the names as the law words them', () => {
    assert.equal(
      allergenText(['milk', { fish: 'anchovy' }, { 'tree-nuts': 'pecan' }, 'soy']),
      'milk, fish (anchovy), tree nuts (pecan), soybeans',
    );
  });

  it('should read the names back, and several kinds of one group in one pair of brackets', () => {
    assert.deepEqual(
      allergensFromText(
        ' Milk, crustacean shellfish (shrimp), tree nuts (almond, pecan), soybeans ',
      ),
      [
        'milk',
        { 'crustacean-shellfish': 'shrimp' },
        { 'tree-nuts': 'almond' },
        { 'tree-nuts': 'pecan' },
        'soy',
      ],
    );
    assert.deepEqual(allergensFromText('soy, tree-nuts (Brazil nut)'), [
      'soy',
      { 'tree-nuts': 'Brazil nut' },
    ]);
    assert.deepEqual(allergensFromText(''), []);
  });

  it('should keep a fish without its kind and an unknown word as typed, for the check to name', () => {
    assert.deepEqual(allergensFromText('fish, mustard, milk (goat)'), [
      'fish',
      'mustard',
      'milk (goat)',
    ]);
  });
});
