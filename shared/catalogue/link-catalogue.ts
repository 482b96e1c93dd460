import { allergenName } from '../calculation/allergens.ts';
import { Decimal } from '../decimal.ts';
import type { ContentProblem } from '../formula/formula-problem.ts';
import type { Formula } from '../formula/formula-types.ts';
import type { Position } from '../formula/locate.ts';
import { sameName } from '../labels/ingredient-statement.ts';
import { closestWord } from '../validation/closest-word.ts';
import type { Catalogue, CatalogueItem } from './catalogue-types.ts';
import { materialLines, type MaterialLine } from './formula-lines.ts';
import { STRENGTH_KEYS, type ItemPlaces } from './read-catalogue.ts';

/** A catalogue that read cleanly, with where it is, for messages that point into it. */
export interface LinkCatalogue {
  readonly catalogue: Catalogue;
  readonly places: readonly ItemPlaces[];
  /** The catalogue's file as problems print it. */
  readonly file: string;
}

/** A formula line and the catalogue item it names. */
export interface LinkedLine {
  readonly line: MaterialLine;
  /** The item's index in the catalogue; undefined when the line links to none. */
  readonly index?: number;
}

const STRENGTH_WORDS = { nitrite: 'sodium nitrite', nitrate: 'sodium nitrate' } as const;

/**
 * The catalogue item each material line of a formula names: the item whose key its `item:` gives,
 * else the one item whose name or formula names match the line's name, however capitalised or
 * spaced.
 */
export function linkLines(formula: Formula, catalogue: Catalogue): LinkedLine[] {
  return materialLines(formula).map((line) => {
    const index = line.item
      ? catalogue.items.findIndex((item) => item.key === line.item)
      : itemNamed(catalogue, line.name);
    return { line, index: index === undefined || index < 0 ? undefined : index };
  });
}

/**
 * The index of the one item a name matches (the item's name or one of its formula names, however
 * capitalised or spaced); undefined when none does, or more than one.
 */
export function itemNamed(catalogue: Catalogue, name: string): number | undefined {
  return onlyOne(namedItems(catalogue.items, name));
}

/**
 * What the catalogue says of a formula: an `item:` (or a cure's `meat_item:`) that names no item
 * is an error; a line with no item is a warning (a kitchen adopts the catalogue gradually); a
 * line whose nitrite or nitrate differs from its item's is an error with both places, since one
 * of them is wrong; an allergen of the item the line does not declare is a warning.
 */
export function catalogueProblems(formula: Formula, linked: LinkCatalogue): ContentProblem[] {
  const { items } = linked.catalogue;
  const unknown = (key: string, path: ContentProblem['path']): ContentProblem[] => {
    const guess = closestWord(
      key,
      items.map((item) => item.key),
    );
    const hint = guess ? `; did you mean "${guess}"?` : '';
    return [
      {
        path,
        severity: 'error',
        message: `there is no item "${key}" in the catalogue (${linked.file})${hint}`,
      },
    ];
  };
  const meat =
    formula.kind === 'cure' && formula.meat_item && !items.some((i) => i.key === formula.meat_item)
      ? unknown(formula.meat_item, ['meat_item'])
      : [];
  return [
    ...meat,
    ...linkLines(formula, linked.catalogue).flatMap(({ line, index }): ContentProblem[] => {
      if (line.item && index === undefined) return unknown(line.item, [...line.path, 'item']);
      if (index === undefined) {
        const matches = namedItems(items, line.name);
        return [
          {
            path: line.path,
            severity: 'warning',
            message:
              matches.length > 1
                ? `"${line.name}" names more than one item in the catalogue (${matches.map((i) => items[i].key).join(', ')}); say which with item:`
                : `"${line.name}" is not in the catalogue (${linked.file}); add it there, or name its item with item:`,
          },
        ];
      }
      return [
        ...strengthProblems(line, items[index], at(linked, index)),
        ...allergenProblems(line, items[index]),
      ];
    }),
  ];
}

/** The indexes of the items a name matches. */
function namedItems(items: readonly CatalogueItem[], name: string): number[] {
  const wanted = sameName(name);
  return items.flatMap((item, i) =>
    [item.name, ...(item.formula_names ?? [])].some((n) => sameName(n) === wanted) ? [i] : [],
  );
}

function onlyOne(indexes: number[]): number | undefined {
  return indexes.length === 1 ? indexes[0] : undefined;
}

function at(linked: LinkCatalogue, index: number): (key: 'nitrite' | 'nitrate') => string {
  return (key) => {
    const place: Position = linked.places[index]?.[key] ?? linked.places[index]?.item;
    return place ? `${linked.file}:${place.line}:${place.column}` : linked.file;
  };
}

function strengthProblems(
  line: MaterialLine,
  item: CatalogueItem,
  where: (key: 'nitrite' | 'nitrate') => string,
): ContentProblem[] {
  return STRENGTH_KEYS.flatMap((key): ContentProblem[] => {
    const inLine = line[key];
    const inItem = item[key];
    // Unstated is none, on either side: a formula counts no nitrite a line does not state.
    if (new Decimal(String(inLine ?? 0)).equals(new Decimal(String(inItem ?? 0)))) return [];
    const word = STRENGTH_WORDS[key];
    if (!line.strengths) {
      return [
        {
          path: line.path,
          severity: 'error',
          message: `the catalogue's "${item.key}" holds ${inItem} % ${word} (${where(key)}), which only a cure formula counts against its limits`,
        },
      ];
    }
    return [
      {
        path: inLine === undefined ? line.path : [...line.path, key],
        severity: 'error',
        message:
          inLine === undefined
            ? `the catalogue's "${item.key}" holds ${inItem} % ${word} (${where(key)}); write ${key}: ${inItem} on this line so the batch counts it`
            : `this line says ${inLine} % ${word} but the catalogue's "${item.key}" says ${inItem ?? 0} % (${where(key)}); one of them is wrong: check the supplier's label`,
      },
    ];
  });
}

function allergenProblems(line: MaterialLine, item: CatalogueItem): ContentProblem[] {
  if (!line.allergens) return [];
  const declared = new Set(line.allergens.map((a) => allergenName(a).toLowerCase()));
  const missing = (item.allergens ?? [])
    .map(allergenName)
    .filter((name) => !declared.has(name.toLowerCase()));
  if (missing.length === 0) return [];
  return [
    {
      path: line.path,
      severity: 'warning',
      message: `the catalogue's "${item.key}" contains ${missing.join(', ')}, which this line does not declare in its allergens`,
    },
  ];
}
