import type { FormulaPath } from '../formula/formula-problem.ts';
import { MAJOR_ALLERGEN_NAMES, KIND_NAMED, isKinded } from '../reference/major-allergens.ts';
import { closestWord } from './closest-word.ts';

/**
 * Why `shellfish` is not a key: US law makes Crustacean shellfish a major allergen, not molluscs,
 * and a cook who writes "shellfish" may mean oysters. Keeping the word would either declare
 * clams as a major allergen or print "crustacean shellfish (oyster)"; the error asks which.
 * source: 21 U.S.C. 321(qq)(1) ("Crustacean shellfish (e.g., crab, lobster, or shrimp)"). text
 * read: FDA, "What is a major food allergen?"; nutrifactshub.com, "Allergen labeling and the 9
 * major allergens" ("mollusks such as clams, mussels, and oysters are not among the major
 * allergens").
 */
const SHELLFISH =
  'US law names crustacean shellfish (shrimp, crab, lobster, crayfish) as a major allergen: ' +
  'write { crustacean-shellfish: shrimp }; clams, oysters, mussels, scallops, squid and other ' +
  'molluscs are not one of the nine, so leave them out of allergens and tell guests in a caution';

/** Every way of writing an allergen item, for the list in an error. */
const FORMS = Object.keys(MAJOR_ALLERGEN_NAMES).map((group) =>
  isKinded(group)
    ? `${item(group, KIND_NAMED[group].example)} (any ${KIND_NAMED[group].what})`
    : group,
);

/**
 * The path of the allergen item an error falls in (the item itself or its kind), or undefined
 * when the error is elsewhere.
 */
export function allergenItemPath(path: FormulaPath): FormulaPath | undefined {
  const at = path.lastIndexOf('allergens');
  if (at < 0 || typeof path[at + 1] !== 'number' || path.length > at + 3) return undefined;
  return path.slice(0, at + 2);
}

/** What is wrong with one item of an `allergens` list, in a cook's words, with how to write it. */
export function allergenMessage(value: unknown): string {
  if (value === 'shellfish') return SHELLFISH;
  if (typeof value === 'string' && isKinded(value)) return askForKind(value);
  if (value === null || typeof value !== 'object' || Array.isArray(value)) return unknown(value);
  const keys = Object.keys(value);
  if (keys.includes('shellfish')) return SHELLFISH;
  if (keys.length !== 1) {
    return keys.length > 1 && keys.every(isKinded)
      ? `one allergen to an item: write ${keys.map((k) => item(k, kindText(value, k))).join(', ')}`
      : unknown(value);
  }
  const [group] = keys;
  if (!isKinded(group)) return unknown(group);
  return kindMessage(group, (value as Record<string, unknown>)[group]);
}

/** An allergen with its kind as a formula writes it, in a list or on a line of its own. */
function item(group: string, kind: string): string {
  return `{ ${group}: ${kind} }`;
}

function kindText(value: object, key: string): string {
  const kind = (value as Record<string, unknown>)[key];
  return typeof kind === 'string' ? kind : KIND_NAMED[key as keyof typeof KIND_NAMED].example;
}

/** The message for a group written with a kind that is missing or not written as one kind. */
function kindMessage(group: keyof typeof KIND_NAMED, kind: unknown): string {
  const parts = Array.isArray(kind)
    ? kind.map(String)
    : typeof kind === 'string'
      ? kind.split(',')
      : [];
  const kinds = parts
    .map((part) => part.replace(/[()]/g, ' ').replace(/\s+/g, ' ').trim())
    .filter(Boolean);
  if (kinds.length > 1)
    return `one kind to an item: write ${kinds.map((k) => item(group, k)).join(', ')}`;
  if (kinds.length === 1 && kinds[0].length > 32)
    return `the ${KIND_NAMED[group].what} is too long (at most 32 characters)`;
  if (kinds.length === 1)
    return `write the ${KIND_NAMED[group].what} plainly, without brackets: ${item(group, kinds[0])}`;
  return askForKind(group);
}

function askForKind(group: keyof typeof KIND_NAMED): string {
  const { ask, what, example } = KIND_NAMED[group];
  return (
    `${ask}: US law wants the ${what} on the label; write ${item(group, example)} ` +
    `(printed "${MAJOR_ALLERGEN_NAMES[group]} (${example})")`
  );
}

function unknown(value: unknown): string {
  const written =
    typeof value === 'string'
      ? `"${value}"`
      : typeof value === 'number' || typeof value === 'boolean'
        ? String(value)
        : 'a list or a set of keys';
  const names = Object.entries(MAJOR_ALLERGEN_NAMES);
  const guess =
    typeof value === 'string'
      ? closestWord(value, [...names.map(([group]) => group), ...names.map(([, name]) => name)])
      : undefined;
  const group = names.find(([key, name]) => guess === key || guess === name)?.[0];
  const hint = group ? `; did you mean "${group}"?` : '';
  return `this allergen must be one of ${FORMS.join(', ')}, not ${written}${hint}`;
}
