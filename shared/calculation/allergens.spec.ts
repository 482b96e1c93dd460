import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { allergenName, collectAllergens, recordedAllergenName } from './allergens.ts';

describe('allergen names', () => {
  // source: 21 U.S.C. 321(qq)(1) names "Crustacean shellfish", "tree nuts" and "soybeans";
  // 21 U.S.C. 343(w)(2) asks for the species of fish or Crustacean shellfish and the type of tree
  // nut. text read: FDA, "What is a major food allergen?" and the FDA Food Allergen Q&A guidance
  // (edition 4, as reproduced at manageartworks.com/blog/fda-food-allergen-labeling-part-2/).
  it('should print each allergen as the law words it, with the kind in brackets', () => {
    assert.equal(allergenName('soy'), 'soybeans');
    assert.equal(allergenName('milk'), 'milk');
    assert.equal(allergenName({ fish: 'anchovy' }), 'fish (anchovy)');
    assert.equal(
      allergenName({ 'crustacean-shellfish': 'shrimp' }),
      'crustacean shellfish (shrimp)',
    );
    assert.equal(allergenName({ 'tree-nuts': 'pecan' }), 'tree nuts (pecan)');
  });
});

describe('recordedAllergenName', () => {
  // source: 21 U.S.C. 321(qq)(1), as above: a batch recorded with the old keys prints the law's words.
  it('should read an old key as the law words it and leave a name as it is', () => {
    assert.equal(recordedAllergenName('tree-nuts'), 'tree nuts');
    assert.equal(recordedAllergenName('soy'), 'soybeans');
    assert.equal(recordedAllergenName('fish (anchovy)'), 'fish (anchovy)');
    assert.equal(recordedAllergenName('shellfish'), 'shellfish');
  });
});

describe('collectAllergens', () => {
  // source: 21 U.S.C. 343(w)(2): every species of fish is named, so anchovy and cod are two
  // declarations; the same species is declared once. common practice, no source (the order).
  it('should keep two kinds of fish apart and the same kind once, in label order', () => {
    const merged = collectAllergens([
      [{ fish: 'cod' }, 'soy'],
      [{ fish: 'anchovy' }, 'milk'],
      [{ fish: 'Anchovy' }, { 'tree-nuts': 'pecan' }],
      undefined,
    ]);
    assert.deepEqual(merged.map(allergenName), [
      'milk',
      'fish (anchovy)',
      'fish (cod)',
      'tree nuts (pecan)',
      'soybeans',
    ]);
  });

  it('should give nothing for no allergens', () => {
    assert.deepEqual(collectAllergens([[], undefined]), []);
  });
});
