import type { FormulaSummary } from '../formula-api-types';

/** The name a formula is listed and sorted by: its title, else its id, else its file. */
export function listedName(item: FormulaSummary): string {
  return item.title ?? item.id ?? item.file;
}

/** Letters without accents or case, so "creme" finds "Crème". */
function folded(text: string): string {
  return text.normalize('NFD').replace(/\p{M}/gu, '').toLowerCase();
}

/**
 * Whether a formula matches what is typed: every word typed is somewhere in its title, id or file
 * name, in any case and with or without accents. Nothing typed matches everything.
 */
export function matchesSearch(item: FormulaSummary, search: string): boolean {
  const words = folded(search).split(/\s+/).filter(Boolean);
  if (words.length === 0) return true;
  const haystack = folded([item.title, item.id, item.file].filter(Boolean).join(' '));
  return words.every((word) => haystack.includes(word));
}

/** Formulas by title as people read it (case and accents aside, numbers in order). */
export function sortedByTitle(items: readonly FormulaSummary[]): FormulaSummary[] {
  const collator = new Intl.Collator('en', { sensitivity: 'base', numeric: true });
  return [...items].sort((a, b) => collator.compare(listedName(a), listedName(b)));
}
