import type { Allergen } from '../formula/formula-types.ts';

/** The nine major allergens in the order US labels usually list them. */
export const MAJOR_ALLERGENS: readonly Allergen[] = [
  'milk',
  'egg',
  'fish',
  'shellfish',
  'tree-nuts',
  'peanuts',
  'wheat',
  'soy',
  'sesame',
];

/** Every allergen in any of the given lists, once each, in label order. */
export function collectAllergens(lists: Iterable<readonly Allergen[] | undefined>): Allergen[] {
  const found = new Set<Allergen>();
  for (const list of lists) for (const allergen of list ?? []) found.add(allergen);
  return MAJOR_ALLERGENS.filter((allergen) => found.has(allergen));
}
