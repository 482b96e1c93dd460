import type { Catalogue } from '../catalogue/catalogue-types.ts';
import { materialLines } from '../catalogue/formula-lines.ts';
import { labelNames } from '../catalogue/label-names.ts';
import { dec } from '../decimal.ts';
import type { Formula } from '../formula/formula-types.ts';
import type { PresentedResult } from '../presentation/presented-result.ts';
import { sameName, type StatementIngredient } from './ingredient-statement.ts';

/** The input a cure's green weight is echoed under (shared/calculation/cure/calculate-cure.ts). */
const GREEN_WEIGHT = 'Green weight';

/** A group printed for reference only, its lines weighed in other groups ("Overall formula"). */
function forReference(title: string): boolean {
  return /\(reference\)\s*$/i.test(title);
}

/**
 * How a cure's meat is named on its label: by its species, "pork", since a cure formula gives
 * the meat as a weight, not as a line the catalogue names. common practice, no source.
 */
function meatName(formula: Formula): string | undefined {
  if (formula.kind !== 'cure' || formula.species === undefined) return undefined;
  const species = formula.species;
  if (Array.isArray(species)) return species.join(' and ');
  return species === 'mixed' ? 'meat' : species;
}

/**
 * The ingredients of a recorded batch as the ingredient statement needs them, from the weights
 * its result holds (what the batch sheet printed, exact): a cure's meat (its green weight), then
 * every line weighed in, named as the catalogue labels it. A result line is matched to the
 * formula line it came from by name (a blend's trim is printed with its fat after it, "chuck trim
 * 85/15 (15 % fat)"); a water or ice line the formula does not name is water; a preferment
 * weighed into a final dough is left out, its own lines being weighed in already, and so are
 * the groups printed for reference only.
 */
export function labelIngredients(
  formula: Formula,
  result: PresentedResult,
  catalogue?: Catalogue,
): StatementIngredient[] {
  const lines = materialLines(formula);
  const names = labelNames(formula, catalogue);
  const named = (printed: string): { name: string; subIngredients?: readonly string[] } => {
    const key = sameName(printed);
    const i = lines.findIndex(
      (line) => key === sameName(line.name) || key.startsWith(`${sameName(line.name)} (`),
    );
    return i < 0 ? { name: printed } : names[i];
  };
  const ingredients: StatementIngredient[] = [];
  const meat = meatName(formula);
  const green = result.inputs.find((input) => input.label === GREEN_WEIGHT)?.exact;
  if (meat && green) ingredients.push({ name: meat, grams: dec(green) });
  for (const group of result.groups) {
    if (forReference(group.title)) continue;
    for (const line of group.lines) {
      if (line.role === 'preferment') continue;
      const label = named(line.name);
      // Ice is water frozen: one ingredient, common practice, no source.
      const water = (line.role === 'water' || line.role === 'ice') && label.name === line.name;
      ingredients.push({
        name: water ? 'water' : label.name,
        grams: dec(line.grams),
        subIngredients: label.subIngredients,
      });
    }
  }
  return ingredients;
}
