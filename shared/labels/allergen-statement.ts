import { allergenParts, collectAllergens } from '../calculation/allergens.ts';
import type { Allergen, AllergenGroup } from '../formula/formula-types.ts';
import { MAJOR_ALLERGEN_NAMES } from '../reference/major-allergens.ts';

/**
 * The allergen statement of a label, "Contains: milk, fish (anchovy)", from the allergens of
 * every ingredient of the food (a batch result's allergens, or the lists of its ingredients), or
 * undefined when the food contains none of the major allergens.
 *
 * The groups come in the order US labels usually list them and each is named as the law names
 * it ("soybeans", "tree nuts"), by the same table the batch sheet uses. Fish, crustacean
 * shellfish and tree nuts carry their kinds in parentheses, alphabetically, each kind once:
 * "fish (anchovy, cod)".
 *
 * source: 21 U.S.C. 343(w)(1)(A): the word "Contains", followed by the name of the food source
 * from which each major food allergen is derived, immediately after or adjacent to the list of
 * ingredients (FD&C Act 403(w), added by FALCPA 2004 §203; wording as described in the FDA Food
 * Allergen Q&A guidance, edition 5, January 2025, and snacksafely.com's summary of FALCPA);
 * 21 U.S.C. 343(w)(2): the species of fish or crustacean shellfish and the type of tree nut are
 * named. The colon after "Contains" and the kinds gathered in one parenthesis per group: common
 * practice, no source.
 */
export function allergenStatement(
  lists: Iterable<readonly Allergen[] | undefined>,
): string | undefined {
  const allergens = collectAllergens(lists);
  if (allergens.length === 0) return undefined;
  const kinds = new Map<AllergenGroup, string[]>();
  for (const allergen of allergens) {
    const { group, kind } = allergenParts(allergen);
    const known = kinds.get(group) ?? [];
    if (kind !== undefined) known.push(kind.trim().replace(/\s+/g, ' '));
    kinds.set(group, known);
  }
  const names = [...kinds].map(([group, groupKinds]) =>
    groupKinds.length === 0
      ? MAJOR_ALLERGEN_NAMES[group]
      : `${MAJOR_ALLERGEN_NAMES[group]} (${groupKinds.join(', ')})`,
  );
  return `Contains: ${names.join(', ')}`;
}
