import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { readFormula } from './read-formula.ts';

/** A mix whose second ingredient (line 7) declares `allergens`. */
function sauceWith(allergens: string): string {
  return [
    'formula: 1',
    'id: test-sauce',
    'title: Test sauce',
    'kind: mix',
    'ingredients:',
    '  - { name: mayonnaise, pct: 100, base: true, allergens: [egg] }',
    `  - { name: Worcestershire sauce, pct: 3, allergens: ${allergens} }`,
    '',
  ].join('\n');
}

function refused(allergens: string) {
  const reading = readFormula(sauceWith(allergens), 'sauce.yaml');
  assert.equal(reading.formula, undefined, 'expected the formula to be refused');
  assert.equal(reading.problems.length, 1, JSON.stringify(reading.problems));
  const [problem] = reading.problems;
  assert.equal(problem.severity, 'error');
  assert.equal(problem.line, 7);
  return problem.message;
}

// source: 21 U.S.C. 343(w)(2) (FALCPA 2004): the label names "in the case of tree nuts, the
// specific type of nut" and "in the case of Crustacean shellfish or fish, the species". text read:
// Massachusetts, "Minimum requirements for packaged food labeling" (mass.gov) and the FDA Food
// Allergen Q&A guidance, edition 5 (2025) section C.3, as quoted at ifsqn.com.
describe('reading allergens with their kind', () => {
  // Both YAML forms read alike: `{ fish: anchovy }`, and `fish: anchovy` inside brackets.
  it('should read fish, crustacean shellfish and tree nuts with their kind', () => {
    const reading = readFormula(
      sauceWith('[fish: anchovy, { crustacean-shellfish: shrimp }, tree-nuts: Brazil nut, soy]'),
      'sauce.yaml',
    );
    assert.deepEqual(reading.problems, []);
    const formula = reading.formula as { ingredients: { allergens?: unknown[] }[] };
    assert.deepEqual(formula.ingredients[1].allergens, [
      { fish: 'anchovy' },
      { 'crustacean-shellfish': 'shrimp' },
      { 'tree-nuts': 'Brazil nut' },
      'soy',
    ]);
  });

  it('should refuse fish without its species, showing how to name it', () => {
    const message = refused('[fish]');
    assert.match(message, /name the fish/);
    assert.match(message, /fish: anchovy/);
    assert.match(message, /fish \(anchovy\)/);
  });

  it('should refuse tree nuts and crustacean shellfish without their kind', () => {
    assert.match(refused('[tree-nuts]'), /name the nut.*tree-nuts: pecan/);
    assert.match(
      refused('[crustacean-shellfish]'),
      /name the shellfish.*crustacean-shellfish: shrimp/,
    );
    assert.match(refused('[fish: ""]'), /name the fish/);
  });

  // source: 21 U.S.C. 321(qq)(1) lists "Crustacean shellfish"; molluscs are not among the nine.
  // text read: nutrifactshub.com, "Allergen labeling and the 9 major allergens" ("mollusks such as
  // clams, mussels, and oysters are not among the major allergens").
  it('should refuse plain shellfish and say that molluscs are not a major allergen', () => {
    for (const written of ['[shellfish]', '[shellfish: oyster]']) {
      const message = refused(written);
      assert.match(message, /crustacean-shellfish: shrimp/);
      assert.match(message, /oysters.*not one of the nine/);
    }
  });

  it('should refuse an unknown allergen and guess the intended one', () => {
    assert.match(refused('[eggs]'), /must be one of milk, egg, .*did you mean "egg"/);
    assert.match(refused('[fish: anchovy, cod: cod]'), /must be one of milk, egg, /);
  });

  it('should refuse two kinds in one item and one kind twice', () => {
    assert.match(refused('[fish: anchovy, fish: anchovy]'), /lists the same thing twice/);
    assert.match(refused('[{ fish: anchovy, tree-nuts: pecan }]'), /one allergen to an item/);
    assert.match(refused('[{ fish: "anchovy, cod" }]'), /\{ fish: anchovy \}, \{ fish: cod \}/);
  });
});
