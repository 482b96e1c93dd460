import { Decimal, HUNDRED } from '../../decimal.ts';
import type { MixFormula } from '../../formula/formula-types.ts';
import {
  type ContentProblem,
  contentError,
  contentWarning,
} from '../../formula/formula-problem.ts';

/**
 * Checks what the schema cannot about a mix formula: exactly one ingredient is the base, the
 * base is at 100 %, and no name is listed twice (ignoring case). Warns when a raw-egg ingredient
 * does not list the egg allergen (the calculation declares it anyway).
 * @returns the problems found; none when the formula can be used
 */
export function checkMixFormula(formula: MixFormula): ContentProblem[] {
  const problems: ContentProblem[] = [];
  const baseIndexes = formula.ingredients.flatMap((ingredient, i) => (ingredient.base ? [i] : []));

  if (baseIndexes.length === 0) {
    problems.push(
      contentError(
        ['ingredients'],
        'mark one ingredient as the base (base: true, pct: 100); the others are percentages of it',
      ),
    );
  }
  for (const i of baseIndexes.slice(1)) {
    const first = formula.ingredients[baseIndexes[0]].name;
    problems.push(
      contentError(
        ['ingredients', i, 'base'],
        `only one ingredient can be the base, and "${first}" already is`,
      ),
    );
  }
  for (const i of baseIndexes) {
    const base = formula.ingredients[i];
    if (!new Decimal(base.pct).equals(HUNDRED)) {
      problems.push(
        contentError(
          ['ingredients', i, 'pct'],
          `the base "${base.name}" must be at 100 %, not ${base.pct} %`,
        ),
      );
    }
  }

  const seen = new Set<string>();
  formula.ingredients.forEach((ingredient, i) => {
    const name = ingredient.name.trim().toLowerCase();
    if (seen.has(name)) {
      problems.push(
        contentError(['ingredients', i, 'name'], `"${ingredient.name}" is listed twice`),
      );
    }
    seen.add(name);
    if (ingredient.raw_egg && !(ingredient.allergens ?? []).includes('egg')) {
      problems.push(
        contentWarning(
          ['ingredients', i, 'allergens'],
          `"${ingredient.name}" is raw egg but does not list the egg allergen; add egg (it is declared anyway)`,
        ),
      );
    }
  });

  return problems;
}
