import type { Allergen, AllergenGroup } from '../formula/formula-types.ts';
import { MAJOR_ALLERGEN_NAMES } from '../reference/major-allergens.ts';

/** The nine major allergens in the order US labels usually list them. */
export const MAJOR_ALLERGENS = Object.keys(MAJOR_ALLERGEN_NAMES) as readonly AllergenGroup[];

/** An allergen taken apart: its group, and its kind when the group needs one. */
export function allergenParts(allergen: Allergen): { group: AllergenGroup; kind?: string } {
  if (typeof allergen === 'string') return { group: allergen };
  const [[group, kind]] = Object.entries(allergen) as [AllergenGroup, string][];
  return { group, kind };
}

/** The allergen as the law words it: "soybeans", "fish (anchovy)", "tree nuts (pecan)". */
export function allergenName(allergen: Allergen): string {
  const { group, kind } = allergenParts(allergen);
  return kind === undefined
    ? MAJOR_ALLERGEN_NAMES[group]
    : `${MAJOR_ALLERGEN_NAMES[group]} (${kind})`;
}

/** The same kind however it is capitalised or spaced ("Anchovy", "anchovy"). */
function sameKind(kind: string): string {
  return kind.trim().replace(/\s+/g, ' ').toLowerCase();
}

/**
 * Every allergen in any of the given lists, in label order. Each kind is its own declaration
 * (fish (anchovy) and fish (cod) are two), in alphabetical order within its group; the same kind
 * is kept once, as first written.
 */
export function collectAllergens(lists: Iterable<readonly Allergen[] | undefined>): Allergen[] {
  const found = new Map<string, { allergen: Allergen; group: AllergenGroup; kind: string }>();
  for (const list of lists) {
    for (const allergen of list ?? []) {
      const { group, kind = '' } = allergenParts(allergen);
      const key = `${group}\u0000${sameKind(kind)}`;
      if (!found.has(key)) found.set(key, { allergen, group, kind: sameKind(kind) });
    }
  }
  const entries = [...found.values()];
  return MAJOR_ALLERGENS.flatMap((group) =>
    entries
      .filter((entry) => entry.group === group)
      .sort((a, b) => (a.kind < b.kind ? -1 : a.kind > b.kind ? 1 : 0))
      .map((entry) => entry.allergen),
  );
}

/**
 * An allergen as a batch recorded it. Batches recorded before kinds were named stored the group's
 * key ("tree-nuts", "soy"); those read as the law words them. Anything else is already a name.
 */
export function recordedAllergenName(recorded: string): string {
  return Object.hasOwn(MAJOR_ALLERGEN_NAMES, recorded)
    ? MAJOR_ALLERGEN_NAMES[recorded as AllergenGroup]
    : recorded;
}
