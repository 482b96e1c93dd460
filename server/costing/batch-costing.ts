import type { Catalogue, CatalogueItem } from '../../shared/catalogue/catalogue-types.ts';
import { linkLines } from '../../shared/catalogue/link-catalogue.ts';
import { OVERALL_FORMULA_TITLE } from '../../shared/calculation/dough/calculate-dough.ts';
import { type BatchCost, type CostInput, batchCost } from '../../shared/costing/batch-cost.ts';
import { finishedWeight } from '../../shared/costing/finished-weight.ts';
import {
  type BaseMeasure,
  baseMeasureOf,
  isReceivedUnit,
} from '../../shared/costing/stock-measure.ts';
import { Decimal } from '../../shared/decimal.ts';
import type { Formula } from '../../shared/formula/formula-types.ts';
import { sameName } from '../../shared/labels/ingredient-statement.ts';
import type { PresentedLine, PresentedResult } from '../../shared/presentation/presented-result.ts';
import type { CostBatchRow, CostRepository, LotUseRow, PriceRow } from './cost-repository.ts';

/** How many batches-made-from-batches deep a cost is followed (a burger ← grind ← trims is 2). */
const MOST_LEVELS = 6;

/** The lines a batch weighed in: a dough's overall formula alone, since its parts repeat it. */
function weighedLines(result: PresentedResult): PresentedLine[] {
  const overall = result.groups.find((group) => group.title === OVERALL_FORMULA_TITLE);
  return (overall ? [overall] : result.groups)
    .flatMap((group) => group.lines)
    .filter((line) => line.role !== 'preferment');
}

/** A line's own name or its name with a note in brackets: "chuck trim 85/15 (15 % fat)". */
function namesLine(formulaName: string, lineName: string): boolean {
  const wanted = sameName(formulaName);
  const line = sameName(lineName);
  return line === wanted || line.startsWith(`${wanted} (`);
}

/**
 * Builds the costs of batches: the lots each drew on, priced at what they were received at; an
 * earlier batch it was made from at that batch's cost per finished kilogram; every weighed line
 * of its calculation with no lot of its item recorded, at the item's latest price on the batch's
 * day. One instance per request: it remembers prices, formulas linked and batches costed.
 */
export class BatchCosting {
  private readonly prices = new Map<string, Promise<PriceRow | undefined>>();
  private readonly batches = new Map<number, Promise<BatchCost>>();
  private readonly links = new Map<string, { name: string; item: CatalogueItem }[]>();

  constructor(
    private readonly repo: CostRepository,
    private readonly catalogue: Catalogue | undefined,
    private readonly formulas: ReadonlyMap<string, Formula>,
  ) {}

  /** The cost of a recorded batch. */
  ofBatch(row: CostBatchRow, portionGrams?: Decimal, level = 0): Promise<BatchCost> {
    const cached = portionGrams === undefined ? this.batches.get(row.id) : undefined;
    if (cached) return cached;
    const cost = (async () => {
      const result = JSON.parse(row.result) as PresentedResult;
      const uses = await this.repo.lotUses(row.id);
      const fromLots = await Promise.all(uses.map((use) => this.lotLine(use, level)));
      const rest = await this.unrecordedLines(result, row.formula_id, uses, row.started_on);
      return batchCost([...fromLots, ...rest], finishedWeight(result, portionGrams));
    })();
    if (portionGrams === undefined) this.batches.set(row.id, cost);
    return cost;
  }

  /** The cost of a batch not recorded yet (a plan's): every line at its latest price on a day. */
  async ofPlanned(result: PresentedResult, formulaId: string, day: string): Promise<BatchCost> {
    const lines = await this.unrecordedLines(result, formulaId, [], day);
    return batchCost(lines, finishedWeight(result));
  }

  private async lotLine(use: LotUseRow, level: number): Promise<CostInput> {
    const amount = new Decimal(use.amount);
    if (use.receipt_id !== null) {
      const base = {
        name: use.item_name ?? use.item,
        item: use.item,
        amount,
        source: 'lot' as const,
        lot: use.receipt_lot ?? undefined,
      };
      if (use.unit_cost === null)
        return { ...base, unpriced: 'the lot was received without a price' };
      if (use.unit === null || !isReceivedUnit(use.unit))
        return { ...base, unpriced: `the lot was received in ${use.unit ?? 'no unit'}` };
      return {
        ...base,
        measure: baseMeasureOf(use.unit),
        price: { perUnit: new Decimal(use.unit_cost), unit: use.unit },
      };
    }
    const source =
      use.source_batch_id === null ? undefined : await this.repo.batchById(use.source_batch_id);
    const base = {
      name: source ? `${source.formula_title} (batch ${source.lot_code})` : use.item,
      item: use.item,
      amount,
      source: 'earlier-batch' as const,
      lot: use.source_lot ?? undefined,
    };
    if (!source) return { ...base, unpriced: 'the earlier batch is not in the log' };
    if (level >= MOST_LEVELS)
      return { ...base, unpriced: `made from batches more than ${MOST_LEVELS} levels deep` };
    const earlier = await this.ofBatch(source, undefined, level + 1);
    if (earlier.perFinishedKg === null)
      return {
        ...base,
        unpriced: earlier.finishedGrams.greaterThan(0)
          ? 'nothing in the earlier batch has a price'
          : 'the earlier batch finished at nothing',
      };
    return { ...base, price: { perUnit: earlier.perFinishedKg, unit: 'kg' } };
  }

  /**
   * The weighed lines of a calculation whose item has no lot recorded, at the latest price; and a
   * cure's meat (its green weight, no formula line) when no lot outside the formula's lines was.
   */
  private async unrecordedLines(
    result: PresentedResult,
    formulaId: string,
    uses: readonly LotUseRow[],
    day: string,
  ): Promise<CostInput[]> {
    const recorded = new Set(uses.map((use) => use.item));
    const linked = this.linked(formulaId);
    const lines: CostInput[] = [];
    const lineItems = new Set<string>();
    for (const line of weighedLines(result)) {
      // An assembly's part comes from a batch of it: priced by the batch recorded, if any.
      if (line.part !== undefined) {
        if (!recorded.has(line.part))
          lines.push({
            name: line.name,
            amount: new Decimal(line.grams),
            source: 'latest-price',
            unpriced: 'no batch of it is recorded as used',
          });
        continue;
      }
      const item =
        linked.find((link) => namesLine(link.name, line.name))?.item ?? this.byName(line.name);
      if (item) lineItems.add(item.key);
      if (item && recorded.has(item.key)) continue;
      lines.push(await this.atLatestPrice(line, item, day));
    }
    const green = result.inputs.find((figure) => figure.label === 'Green weight')?.exact;
    const meatRecorded = uses.some((use) => !lineItems.has(use.item));
    if (result.formula.kind === 'cure' && green !== undefined && !meatRecorded) {
      lines.unshift({
        name: 'the meat (green weight)',
        amount: new Decimal(green),
        source: 'latest-price',
        unpriced: 'no lot of the meat was recorded, and the formula names no item for it',
      });
    }
    return lines;
  }

  private async atLatestPrice(
    line: PresentedLine,
    item: CatalogueItem | undefined,
    day: string,
  ): Promise<CostInput> {
    const grams = new Decimal(line.grams);
    if (!item) {
      return {
        name: line.name,
        amount: grams,
        source: 'latest-price',
        unpriced: 'not in the catalogue of materials',
      };
    }
    const base = { name: item.name, item: item.key, source: 'latest-price' as const };
    // Water measured by volume counts 1 g a millilitre (shared/units/volume.ts).
    const measure: BaseMeasure | undefined =
      baseMeasureOf(item.unit) === 'g'
        ? 'g'
        : baseMeasureOf(item.unit) === 'ml' && (line.role === 'water' || line.role === 'ice')
          ? 'ml'
          : undefined;
    if (!measure) {
      return {
        ...base,
        amount: grams,
        unpriced: `stocked by ${item.unit === 'each' ? 'count' : 'volume'}, weighed in the batch`,
      };
    }
    const price = await this.latestPrice(item.key, day);
    if (!price) return { ...base, amount: grams, measure, unpriced: 'never received with a price' };
    if (!isReceivedUnit(price.unit) || baseMeasureOf(price.unit) !== measure) {
      return { ...base, amount: grams, measure, unpriced: `last received in ${price.unit}` };
    }
    return {
      ...base,
      amount: grams,
      measure,
      price: { perUnit: new Decimal(price.unit_cost), unit: price.unit },
    };
  }

  private latestPrice(item: string, day: string): Promise<PriceRow | undefined> {
    const key = `${item}\n${day}`;
    let price = this.prices.get(key);
    if (!price) {
      price = this.repo.latestPrice(item, day);
      this.prices.set(key, price);
    }
    return price;
  }

  /** A formula's lines with the item each links to, as the formula is now. */
  private linked(formulaId: string): { name: string; item: CatalogueItem }[] {
    const known = this.links.get(formulaId);
    if (known) return known;
    const formula = this.formulas.get(formulaId);
    const catalogue = this.catalogue;
    const links =
      formula && catalogue
        ? linkLines(formula, catalogue).flatMap(({ line, index }) =>
            index === undefined ? [] : [{ name: line.name, item: catalogue.items[index] }],
          )
        : [];
    this.links.set(formulaId, links);
    return links;
  }

  /** The one catalogue item a name matches, as a formula line with no `item:` links. */
  private byName(name: string): CatalogueItem | undefined {
    const matches = (this.catalogue?.items ?? []).filter((item) =>
      [item.name, ...(item.formula_names ?? [])].some((n) => sameName(n) === sameName(name)),
    );
    return matches.length === 1 ? matches[0] : undefined;
  }
}
