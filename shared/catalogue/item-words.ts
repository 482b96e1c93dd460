import type { CatalogueItem } from './catalogue-types.ts';

/**
 * What the kitchen calls an item: its first formula name ("pork belly", "cracked black pepper"),
 * else the name its label prints. Label names repeat across items (pork for the belly, the leg and
 * the shoulder), so a cook choosing or reading a lot needs the kitchen's own word for it.
 */
export function itemWords(item: CatalogueItem): string {
  return item.formula_names?.[0] ?? item.name;
}
