import { type Decimal, ZERO } from '../decimal.ts';

/**
 * One ingredient of a batch as the ingredient statement needs it: its name, its weight in the
 * batch, and, for a compound ingredient, the sub-ingredients it is made of.
 *
 * A formula line carries its nitrite and salt percentages, not the names of a compound
 * ingredient's own ingredients: those come from the line's item in the catalogue of materials
 * (labelNames in shared/catalogue/label-names.ts). The sub-ingredients are names in the order
 * of the supplier's own ingredient statement, which that label already gives in descending order
 * of predominance (21 CFR 101.4(a)(1)), so their order is kept as given; no percentages are
 * needed. A batch result's amount line (name and grams) fits this shape, without sub-ingredients.
 */
export interface StatementIngredient {
  /** The common or usual name, as it is to be printed: "curing salt". */
  readonly name: string;
  /** Weight in the batch as weighed in, any one unit for the whole batch (grams inside). */
  readonly grams: Decimal;
  /** A compound ingredient's own ingredients, in the order of its supplier's statement. */
  readonly subIngredients?: readonly string[];
}

/** One entry of the statement, heaviest first. */
export interface StatementEntry {
  readonly name: string;
  /** The ingredient's weight in the batch, all lines of the same name added up. */
  readonly grams: Decimal;
  readonly subIngredients: readonly string[];
}

/** The statement worked out: its entries in order and its printed text. */
export interface IngredientStatement {
  readonly entries: readonly StatementEntry[];
  /** "pork belly, water, salt, curing salt (salt, sodium nitrite)" */
  readonly list: string;
  /** The list after the word the label rules ask for: "Ingredients: pork belly, …". */
  readonly text: string;
}

/** An ingredient name as compared: however it is capitalised or spaced ("Salt", "salt "). */
export function sameName(name: string): string {
  return name.trim().replace(/\s+/g, ' ').toLowerCase();
}

/** An entry as printed: the name, then any sub-ingredients in parentheses. */
export function entryText(entry: StatementEntry): string {
  if (entry.subIngredients.length === 0) return entry.name;
  return `${entry.name} (${entry.subIngredients.join(', ')})`;
}

/**
 * The ingredient statement of a batch: every ingredient by its name in descending order of
 * predominance by weight, a compound ingredient followed by its sub-ingredients in parentheses.
 * Lines of the same name (salt weighed in twice) are one ingredient, their weights added, at the
 * place of the first. Ingredients of equal weight keep the formula's order. Ingredients weighing
 * nothing in this batch are left out.
 *
 * The 2 % rule of 21 CFR 101.4(a)(2) ("Contains 2 percent or less of …") is not applied: every
 * ingredient is placed by its weight, which the rules always allow.
 *
 * source: 21 CFR 101.4(a)(1), "listed by common or usual name in descending order of predominance
 * by weight"; 21 CFR 101.4(b)(2)(i), a multi-ingredient ingredient by "its established common or
 * usual name followed by a parenthetical listing of all ingredients contained therein" (wording
 * read in the 2006 CFR edition as reproduced at grokfood.com/regulations/101.4.htm; (b)(2) from
 * memory, re-check against eCFR). For meat and poultry products, 9 CFR 317.2(c)(2): "the word
 * 'ingredients' followed by a list of the ingredients as prescribed in paragraph (f)" (read at
 * foodcompliance.com); that (f)(1) asks for the same descending order is from memory, re-check
 * against eCFR.
 * @throws RangeError when a weight is negative
 */
export function ingredientStatement(
  ingredients: readonly StatementIngredient[],
): IngredientStatement {
  const byName = new Map<string, { name: string; grams: Decimal; subIngredients: string[] }>();
  for (const ingredient of ingredients) {
    if (ingredient.grams.lessThan(ZERO)) {
      throw new RangeError(`ingredientStatement: ${ingredient.name} weighs less than nothing`);
    }
    const key = sameName(ingredient.name);
    const known = byName.get(key);
    if (known === undefined) {
      byName.set(key, {
        name: ingredient.name.trim(),
        grams: ingredient.grams,
        subIngredients: [...(ingredient.subIngredients ?? [])],
      });
    } else {
      known.grams = known.grams.plus(ingredient.grams);
      if (known.subIngredients.length === 0)
        known.subIngredients = [...(ingredient.subIngredients ?? [])];
    }
  }
  // Array.prototype.sort is stable, so equal weights keep the order they were first written in.
  const entries: StatementEntry[] = [...byName.values()]
    .filter((entry) => entry.grams.greaterThan(ZERO))
    .sort((a, b) => b.grams.comparedTo(a.grams));
  const list = entries.map(entryText).join(', ');
  return { entries, list, text: `Ingredients: ${list}` };
}
