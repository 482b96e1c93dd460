/**
 * What a batch needs from stock: the amount of each catalogue item its lines weigh, in the item's
 * base measure, from the calculation it was recorded with and the weights as weighed. Pure: the
 * records pass in the formula, the presented result and the standing weights.
 */
import type { Catalogue, CatalogueItem, StockUnit } from '../catalogue/catalogue-types.ts';
import { linkLines } from '../catalogue/link-catalogue.ts';
import { Decimal, ZERO } from '../decimal.ts';
import type { Formula } from '../formula/formula-types.ts';
import { sameName } from '../labels/ingredient-statement.ts';
import type { PresentedResult } from '../presentation/presented-result.ts';
import type { StandingWeights } from '../process/weights-as-weighed.ts';
import { baseMeasureOf, gramsToBase, type BaseMeasure } from './base-measure.ts';
import { itemWords } from '../catalogue/item-words.ts';

/** What a batch needs of one catalogue item. */
export interface ItemNeed {
  /** The catalogue item's key. */
  readonly item: string;
  /** The item's name as the catalogue gives it. */
  readonly name: string;
  /** The unit the item is received in. */
  readonly unit: StockUnit;
  readonly measure: BaseMeasure;
  /**
   * How much, in the base measure: grams turned into pieces or millilitres through the
   * catalogue's weight per unit (pieces rounded up); null when the formula weighs what the lots
   * count or measure by volume and the catalogue gives no weight per unit: the cook says how much
   * of a lot went in.
   */
  readonly amount: Decimal | null;
  /** The grams the batch's lines weigh of it (as weighed where weighed). */
  readonly grams: Decimal;
  /** The catalogue's weight per unit (`weighs:`), when it gives one. */
  readonly weighs?: string;
  /** The lines of the batch's sheet it is for, as the sheet names them. */
  readonly lines: readonly string[];
  /** Whether every one of those lines was weighed (else some count at their calculated grams). */
  readonly weighed: boolean;
}

/** A line of the batch no catalogue item is linked to: it cannot draw on stock. */
export interface UnlinkedNeed {
  readonly name: string;
  readonly grams: Decimal;
  readonly weighed: boolean;
}

/** Everything a batch draws on. */
export interface BatchNeeds {
  readonly items: readonly ItemNeed[];
  readonly unlinked: readonly UnlinkedNeed[];
}

/** The input a cure's green weight is echoed under (shared/calculation/cure/calculate-cure.ts). */
const GREEN_WEIGHT = 'Green weight';

/** How a cure's meat is named among the batch's lines: a formula gives it as a weight, not a line. */
export const CURE_MEAT_LINE = 'meat (green weight)';

interface SheetLine {
  readonly name: string;
  grams: Decimal;
  readonly water: boolean;
}

/**
 * The lines weighed into the batch, by name, calculated grams added up: a group printed for
 * reference only ("Overall formula (reference)") is weighed in the others, and a preferment
 * weighed into a final dough is made of lines weighed already.
 */
function weighedIn(result: PresentedResult): SheetLine[] {
  const byName = new Map<string, SheetLine>();
  for (const group of result.groups) {
    if (/\(reference\)\s*$/i.test(group.title)) continue;
    for (const line of group.lines) {
      if (line.role === 'preferment') continue;
      const seen = byName.get(line.name);
      const grams = new Decimal(line.grams);
      if (seen) seen.grams = seen.grams.plus(grams);
      else
        byName.set(line.name, {
          name: line.name,
          grams,
          water: line.role === 'water' || line.role === 'ice',
        });
    }
  }
  return [...byName.values()];
}

/** The catalogue items a name matches by name or formula name, however capitalised or spaced. */
function itemsNamed(items: readonly CatalogueItem[], name: string): CatalogueItem[] {
  const wanted = sameName(name);
  return items.filter((item) =>
    [item.name, ...(item.formula_names ?? [])].some((n) => sameName(n) === wanted),
  );
}

/**
 * The catalogue item of a sheet line: the item its formula line links to (a blend's trim is
 * printed with its fat after its name, "chuck trim 85/15 (15 % fat)"); a line the formula does
 * not name (a brine's water) links to the one item of its name.
 */
function itemOfLine(
  sheetName: string,
  linked: readonly { name: string; item?: CatalogueItem }[],
  catalogue: Catalogue,
): CatalogueItem | undefined {
  const key = sameName(sheetName);
  const line = linked.find(
    ({ name }) => key === sameName(name) || key.startsWith(`${sameName(name)} (`),
  );
  if (line) return line.item;
  const named = itemsNamed(catalogue.items, sheetName);
  return named.length === 1 ? named[0] : undefined;
}

/**
 * What a batch of a formula needs of each catalogue item, in the item's base measure, from the
 * lines its sheet weighs in: a line weighed counts at its standing weight (a name on two lines,
 * a brine's and its cover's water, is weighed once for both), else at its calculated grams.
 * Lines of one item add up; a cure's meat, its green weight (the 'green' stage when weighed),
 * needs the formula's meat_item; a line linked to no item is listed apart. An assembly needs
 * nothing from stock here: its parts are batches (see partNeeds and sourceBatchOrder).
 * @param catalogue the catalogue of materials; without one every line is listed apart
 */
export function batchNeeds(
  formula: Formula,
  result: PresentedResult,
  weights: StandingWeights,
  catalogue?: Catalogue,
): BatchNeeds {
  if (formula.kind === 'assembly') return { items: [], unlinked: [] };
  const linked = catalogue
    ? linkLines(formula, catalogue).map(({ line, index }) => ({
        name: line.name,
        item: index === undefined ? undefined : catalogue.items[index],
      }))
    : [];
  const items = new Map<string, { item: CatalogueItem; need: ItemNeedDraft }>();
  const unlinked: UnlinkedNeed[] = [];
  const lines = weighedIn(result).map((line) => {
    const actual = weights.lines.get(line.name);
    const item = catalogue ? itemOfLine(line.name, linked, catalogue) : undefined;
    return { ...line, grams: actual ?? line.grams, weighed: actual !== undefined, item };
  });
  if (formula.kind === 'cure') {
    const calculated = result.inputs.find((input) => input.label === GREEN_WEIGHT)?.exact;
    const green = weights.stages.get('green');
    const item = catalogue?.items.find((i) => i.key === formula.meat_item);
    if (green || calculated)
      lines.unshift({
        name: CURE_MEAT_LINE,
        grams: green ?? new Decimal(calculated!),
        water: false,
        weighed: green !== undefined,
        item,
      });
  }
  for (const { name, grams, water: waterLine, weighed, item } of lines) {
    if (!item) {
      unlinked.push({ name, grams, weighed });
      continue;
    }
    const entry = items.get(item.key) ?? {
      item,
      need: { water: ZERO, other: ZERO, lines: [] as string[], weighed: true },
    };
    if (waterLine || item.kind === 'water') entry.need.water = entry.need.water.plus(grams);
    else entry.need.other = entry.need.other.plus(grams);
    entry.need.lines.push(name);
    entry.need.weighed &&= weighed;
    items.set(item.key, entry);
  }
  return {
    items: [...items.values()].map(({ item, need }) => ({
      item: item.key,
      name: itemWords(item),
      unit: item.unit,
      measure: baseMeasureOf(item.unit),
      amount: inBase(need, item),
      grams: need.water.plus(need.other),
      ...(item.weighs ? { weighs: item.weighs } : {}),
      lines: need.lines,
      weighed: need.weighed,
    })),
    unlinked,
  };
}

interface ItemNeedDraft {
  /** Grams of the item's lines weighed as water (the water convention), and of the others. */
  water: Decimal;
  other: Decimal;
  lines: string[];
  weighed: boolean;
}

/**
 * An item's grams in its base measure, added up before they are turned (so pieces are rounded
 * up once for the batch, not line by line); null when some cannot be turned.
 */
function inBase(need: ItemNeedDraft, item: CatalogueItem): Decimal | null {
  let amount = ZERO;
  for (const [grams, water] of [
    [need.water, true],
    [need.other, false],
  ] as const) {
    if (grams.isZero()) continue;
    const base = gramsToBase(grams, item, water);
    if (base === undefined) return null;
    amount = amount.plus(base);
  }
  return amount;
}
