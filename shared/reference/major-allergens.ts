import type { AllergenGroup, KindedAllergen } from '../formula/formula-types.ts';

/**
 * The nine major food allergens of US law, in the order US labels usually list them, each with
 * the name the law gives it.
 * source: 21 U.S.C. 321(qq)(1) (FD&C Act 201(qq), from FALCPA 2004; sesame added by the FASTER
 * Act of 2021): "milk, egg, fish (e.g., bass, flounder, or cod), Crustacean shellfish (e.g.,
 * crab, lobster, or shrimp), tree nuts (e.g., almonds, pecans, or walnuts), wheat, peanuts,
 * soybeans, and sesame". text read: FDA, "What is a major food allergen?"
 * (fda.gov/industry/fda-basics-industry/what-major-food-allergen); FDA, "The FASTER Act: Sesame
 * Is the Ninth Major Food Allergen" (fda.gov/food/food-allergies).
 */
export const MAJOR_ALLERGEN_NAMES: Readonly<Record<AllergenGroup, string>> = {
  milk: 'milk',
  egg: 'egg',
  fish: 'fish',
  'crustacean-shellfish': 'crustacean shellfish',
  'tree-nuts': 'tree nuts',
  peanuts: 'peanuts',
  wheat: 'wheat',
  soy: 'soybeans',
  sesame: 'sesame',
};

/**
 * The three groups whose kind the label must name, with what a cook is asked for and an example
 * kind. source: 21 U.S.C. 343(w)(2) (FD&C Act 403(w)(2)): "in the case of tree nuts, the specific
 * type of nut", "in the case of Crustacean shellfish or fish, the species". text read:
 * Massachusetts, "Minimum requirements for packaged food labeling" (mass.gov); FDA Food Allergen
 * Q&A guidance, edition 4 (species by the market name of The Seafood List; "Contains salmon" is
 * accepted), as reproduced at manageartworks.com/blog/fda-food-allergen-labeling-part-2/.
 */
export const KIND_NAMED: Readonly<
  Record<KindedAllergen, { ask: string; what: string; example: string }>
> = {
  fish: { ask: 'name the fish', what: 'species of fish', example: 'anchovy' },
  'crustacean-shellfish': {
    ask: 'name the shellfish',
    what: 'species of shellfish',
    example: 'shrimp',
  },
  'tree-nuts': { ask: 'name the nut', what: 'type of nut', example: 'pecan' },
};

/** Whether a group's kind must be named (fish, crustacean shellfish, tree nuts). */
export function isKinded(group: string): group is KindedAllergen {
  return Object.hasOwn(KIND_NAMED, group);
}
