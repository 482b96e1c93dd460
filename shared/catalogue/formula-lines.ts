import type { Allergen, Formula } from '../formula/formula-types.ts';
import type { FormulaPath } from '../formula/formula-problem.ts';

/** One line of a formula that names a material: an ingredient, or a blend's trim. */
export interface MaterialLine {
  readonly path: FormulaPath;
  readonly name: string;
  readonly item?: string;
  /** Whether the line can state nitrite and nitrate (a cure's ingredients): others count none. */
  readonly strengths: boolean;
  readonly nitrite?: number;
  readonly nitrate?: number;
  /** The allergens the line declares; undefined where the line has no such key (a trim). */
  readonly allergens?: readonly Allergen[];
}

type Line = {
  name: string;
  item?: string;
  nitrite?: number;
  nitrate?: number;
  allergens?: Allergen[];
};

function lines(key: string, list: readonly Line[] | undefined, strengths = false): MaterialLine[] {
  return (list ?? []).map((line, i) => ({
    path: [key, i],
    name: line.name,
    item: line.item,
    strengths,
    nitrite: line.nitrite,
    nitrate: line.nitrate,
    allergens: line.allergens ?? [],
  }));
}

/**
 * Every line of a formula that names a material, in file order: a cure's ingredients and cover
 * brine, a dough's ingredients (its preferment names them again, so not that), a blend's trims
 * and seasoning, a mix's ingredients. An assembly names formulas, not materials.
 */
export function materialLines(formula: Formula): MaterialLine[] {
  switch (formula.kind) {
    case 'cure':
      return [
        ...lines('ingredients', formula.ingredients, true),
        ...lines('cover_brine', formula.cover_brine, true),
      ];
    case 'dough':
    case 'mix':
      return lines('ingredients', formula.ingredients);
    case 'blend':
      return [
        ...formula.components.map((trim, i) => ({
          path: ['components', i],
          name: trim.name,
          item: trim.item,
          strengths: false,
        })),
        ...lines('ingredients', formula.ingredients),
      ];
    case 'assembly':
      return [];
  }
}
