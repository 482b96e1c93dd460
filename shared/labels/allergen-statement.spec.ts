import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { allergenStatement } from './allergen-statement.ts';

describe('allergenStatement', () => {
  // source: 21 U.S.C. 343(w)(1)(A), the word "Contains" followed by the food source of each major
  // allergen; 21 U.S.C. 343(w)(2), the species of fish named (FDA Food Allergen Q&A guidance,
  // edition 5, 2025). The form "Contains: milk, fish (anchovy)" is the issue's own wording.
  it('should name milk and the fish by its kind after the word Contains', () => {
    assert.equal(
      allergenStatement([['milk'], [{ fish: 'anchovy' }]]),
      'Contains: milk, fish (anchovy)',
    );
  });

  // source: 21 U.S.C. 321(qq)(1) names "Crustacean shellfish", "tree nuts" and "soybeans" and
  // lists milk, egg, fish, Crustacean shellfish, tree nuts, wheat, peanuts, soybeans, sesame;
  // the order of the label is the order the project's table keeps (common practice, no source).
  it('should name every group as the law does, in the label order, each kind once', () => {
    assert.equal(
      allergenStatement([
        ['sesame', 'soy', { fish: 'cod' }],
        [{ 'tree-nuts': 'pecan' }, 'wheat', { fish: 'Anchovy' }],
        [{ fish: 'anchovy' }, 'egg', { 'crustacean-shellfish': 'shrimp' }, 'milk'],
        [{ 'tree-nuts': 'almond' }, 'peanuts'],
        undefined,
      ]),
      'Contains: milk, egg, fish (Anchovy, cod), crustacean shellfish (shrimp), ' +
        'tree nuts (almond, pecan), peanuts, wheat, soybeans, sesame',
    );
  });

  // derived: a food with no major allergen has no "Contains" statement to print
  it('should give no statement when the food contains none of the major allergens', () => {
    assert.equal(allergenStatement([[], undefined]), undefined);
  });
});
