import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import { formatProblem, readFormula } from '../../shared/index.ts';
import { RECIPES, corpusFile, isExpected, recipeText } from '../fixtures/bad-formula-recipes.ts';

describe('the bad-formula corpus', () => {
  it('should hold at least 100 files', () => {
    assert.ok(RECIPES.length >= 100, `${RECIPES.length} files`);
  });

  for (const recipe of RECIPES) {
    it(`should refuse ${recipe.name} at line ${recipe.line} with "${recipe.message.slice(0, 60)}"`, () => {
      const file = corpusFile(recipe);
      const text = readFileSync(file, 'utf8');
      assert.equal(
        text,
        recipeText(recipe),
        'the corpus file is as its recipe makes it (npm run corpus)',
      );
      const reading = readFormula(text, path.basename(file));
      assert.equal(reading.formula, undefined, 'the formula is refused');
      assert.ok(
        reading.problems.some((problem) => isExpected(problem, recipe)),
        `expected line ${recipe.line}: ${recipe.message}\ngot:\n${reading.problems.map(formatProblem).join('\n')}`,
      );
    });
  }
});
