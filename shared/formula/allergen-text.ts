import { MAJOR_ALLERGEN_NAMES, isKinded } from '../reference/major-allergens.ts';
import type { Allergen, AllergenGroup } from './formula-types.ts';

/**
 * An ingredient's allergens as one line a cook reads and types (the console's ingredient table):
 * the names as the law words them, "milk, fish (anchovy), tree nuts (pecan), soybeans". Items a
 * formula being edited may hold but the schema refuses are written as they are, to be corrected.
 */
export function allergenText(allergens: readonly unknown[]): string {
  return allergens.map(itemText).join(', ');
}

function itemText(item: unknown): string {
  const name = (key: string): string =>
    Object.hasOwn(MAJOR_ALLERGEN_NAMES, key) ? MAJOR_ALLERGEN_NAMES[key as AllergenGroup] : key;
  if (typeof item === 'string') return name(item);
  const entries = item !== null && typeof item === 'object' ? Object.entries(item) : [];
  if (entries.length !== 1) return JSON.stringify(item) ?? '';
  const [[key, kind]] = entries;
  return `${name(key)} (${Array.isArray(kind) ? kind.join(', ') : String(kind)})`;
}

/** The group a word names, by its name in law ("soybeans") or its key in a formula ("soy"). */
function groupNamed(word: string): AllergenGroup | undefined {
  const plain = word.toLowerCase().replace(/[\s-]+/g, ' ');
  return (Object.entries(MAJOR_ALLERGEN_NAMES) as [AllergenGroup, string][]).find(
    ([group, name]) => name === plain || group.replace(/-/g, ' ') === plain,
  )?.[0];
}

/**
 * The allergens a line of text names, as a formula writes them: "fish (anchovy)" is
 * `{ fish: anchovy }`, and "tree nuts (almond, pecan)" two tree nuts. Whatever names no allergen,
 * or a fish without its kind, is kept as typed, so the formula's check says what is wrong with it.
 */
export function allergensFromText(text: string): (Allergen | string)[] {
  const parts = text.match(/[^,(]+(\([^)]*\)?)?/g) ?? [];
  return parts.flatMap((part): (Allergen | string)[] => {
    const typed = part.trim().replace(/\s+/g, ' ');
    const match = /^([^(]*?)\s*(?:\(([^)]*)\)?)?$/.exec(typed);
    const group = match ? groupNamed(match[1]) : undefined;
    const kinds = (match?.[2] ?? '')
      .split(',')
      .map((kind) => kind.trim())
      .filter(Boolean);
    if (!typed) return [];
    if (!group || (!isKinded(group) && kinds.length > 0)) return [typed];
    if (!isKinded(group) || kinds.length === 0) return [group];
    return kinds.map((kind) => ({ [group]: kind }) as Allergen);
  });
}
