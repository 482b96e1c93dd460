import type { FormulaPath } from '../formula/formula-problem.ts';
import type { Formula } from '../formula/formula-types.ts';
import type { Catalogue } from './catalogue-types.ts';
import { materialLines } from './formula-lines.ts';
import { linkLines } from './link-catalogue.ts';

/** How one material line of a formula is named on a label. */
export interface LabelName {
  /** The line in the formula: ['ingredients', 2]. */
  readonly path: FormulaPath;
  /** Its item's name when it links to one ("salt" for kosher salt), else the line's own name. */
  readonly name: string;
  /** Its item's own ingredients, in the order of the supplier's label, for a compound one. */
  readonly subIngredients?: readonly string[];
}

/**
 * The label names of a formula's material lines, in file order: what the ingredient statement
 * (shared/labels/ingredient-statement.ts) prints for each, with the line's weight in a batch
 * beside it. A line with no item, or a formula read without a catalogue, keeps its own name.
 */
export function labelNames(formula: Formula, catalogue?: Catalogue): LabelName[] {
  if (!catalogue) return materialLines(formula).map(({ path, name }) => ({ path, name }));
  return linkLines(formula, catalogue).map(({ line, index }) => {
    const item = index === undefined ? undefined : catalogue.items[index];
    if (!item) return { path: line.path, name: line.name };
    return { path: line.path, name: item.name, subIngredients: item.sub_ingredients };
  });
}
