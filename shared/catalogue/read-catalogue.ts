import type { ContentProblem, FormulaProblem } from '../formula/formula-problem.ts';
import type { Position } from '../formula/locate.ts';
import { readYamlValue, sortByPosition } from '../formula/read-formula.ts';
import { sameName } from '../labels/ingredient-statement.ts';
import { catalogueSchemaErrors } from '../validation/catalogue-validator.ts';
import { schemaProblems } from '../validation/schema-messages.ts';
import { QuantityError } from '../units/quantity-error.ts';
import type { Catalogue, CatalogueItem } from './catalogue-types.ts';
import { parseItemWeight } from './item-weight.ts';

/** The strengths a formula line and its item must agree on, % by weight. */
export const STRENGTH_KEYS = ['nitrite', 'nitrate'] as const;

/** Where an item and its strengths are in the catalogue file, for problems found elsewhere. */
export interface ItemPlaces {
  readonly item: Position;
  readonly nitrite?: Position;
  readonly nitrate?: Position;
}

/** The catalogue read from text: the catalogue when it can be used, and every problem found. */
export interface CatalogueReading {
  /** Present when there are no errors. */
  readonly catalogue?: Catalogue;
  /** Where each item is, in the order of the items. */
  readonly places: readonly ItemPlaces[];
  readonly problems: readonly FormulaProblem[];
}

/**
 * Reads catalogue YAML: syntax and the limits of a formula file, then its JSON Schema, then
 * what the schema cannot say (each key once; a formula name given to one item only). Every
 * problem carries the file, line and column. Pure: the caller reads the file.
 */
export function readCatalogue(text: string, file: string): CatalogueReading {
  const read = readYamlValue(
    text,
    file,
    'a catalogue file is a set of keys (catalogue: 1, then items:, a list of the materials)',
  );
  if (!read.ok) return { places: [], problems: read.problems };
  const { value, place, locate } = read;
  const errors = catalogueSchemaErrors(value);
  if (errors.length > 0)
    return { places: [], problems: sortByPosition(schemaProblems(errors, value).map(place)) };
  const catalogue = value as unknown as Catalogue;
  const places = catalogue.items.map((item, i): ItemPlaces => {
    const at = (key: string): Position | undefined =>
      key in item ? locate(['items', i, key]) : undefined;
    return { item: locate(['items', i]), nitrite: at('nitrite'), nitrate: at('nitrate') };
  });
  const problems = sortByPosition(itemProblems(catalogue.items).map(place));
  return problems.length > 0 ? { places, problems } : { catalogue, places, problems };
}

/** A weight per unit that does not read for its item's unit, at its place. */
function weightProblem(item: CatalogueItem, i: number): ContentProblem | undefined {
  if (item.weighs === undefined) return undefined;
  try {
    parseItemWeight(item.weighs, item.unit);
    return undefined;
  } catch (error) {
    if (!(error instanceof QuantityError)) throw error;
    return { path: ['items', i, 'weighs'], severity: 'error', message: error.message };
  }
}

/** Keys used twice, formula names given to two items, weights per unit that do not read. */
function itemProblems(items: readonly CatalogueItem[]): ContentProblem[] {
  const problems: ContentProblem[] = [];
  items.forEach((item, i) => {
    const weight = weightProblem(item, i);
    if (weight) problems.push(weight);
  });
  const keys = new Map<string, number>();
  const formulaNames = new Map<string, number>();
  items.forEach((item, i) => {
    const first = keys.get(item.key);
    if (first === undefined) keys.set(item.key, i);
    else
      problems.push({
        path: ['items', i, 'key'],
        severity: 'error',
        message: `the key "${item.key}" is already item ${first + 1}'s; every item needs its own key`,
      });
    (item.formula_names ?? []).forEach((name, j) => {
      const owner = formulaNames.get(sameName(name));
      if (owner === undefined || owner === i) formulaNames.set(sameName(name), i);
      else
        problems.push({
          path: ['items', i, 'formula_names', j],
          severity: 'error',
          message: `"${name}" is already a formula name of item ${owner + 1} (${items[owner].key}); a formula name may belong to one item only`,
        });
    });
  });
  return problems;
}
