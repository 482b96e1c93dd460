import type { PlanResult } from '../calculation/plan/plan-types.ts';
import type { Catalogue } from '../catalogue/catalogue-types.ts';
import type { Decimal } from '../decimal.ts';
import type { Formula } from '../formula/formula-types.ts';
import { weekdayDayWords, dayWords } from '../presentation/date-words.ts';
import { formatMass } from '../presentation/format-figure.ts';
import type { UnitSystem } from '../units/scale-amount.ts';
import type { StockLot } from './fifo.ts';
import { lotAmountWords } from '../presentation/lot-amount.ts';
import type { BaseMeasure } from './base-measure.ts';
import { planItemNeeds, type PlanItemNeed } from './plan-item-needs.ts';
import type {
  ApartReason,
  PlanStock,
  PresentedAmount,
  PresentedPullLine,
  PresentedWeight,
} from './plan-stock-types.ts';
import { type LastDelivery, type PullLine, pullAgainstStock } from './pull-list.ts';

/** The lots on hand and the latest delivery of each item, as the records give them. */
export interface StockOnHand {
  /** Lots not emptied and not refused. */
  readonly lots: readonly StockLot[];
  /** The latest delivery taken in of each item, by item key. */
  readonly lastFrom: ReadonlyMap<string, LastDelivery>;
}

/** Why a material is not compared, in a cook's words. */
function whyApart(reason: ApartReason, name: string): string {
  switch (reason) {
    case 'no-item':
      return 'not in the catalogue of materials: check the stock by hand';
    case 'tap-water':
      return 'water from the tap: not kept in lots';
    case 'by-volume':
      return `stocked by volume but weighed in the formulas, and the catalogue of materials gives no weight for a volume of ${name}: check the stock by hand`;
    case 'by-count':
      return `stocked by count but weighed in the formulas, and the catalogue of materials gives no weight for one ${name}: check the stock by hand`;
  }
}

/** How the comparison is made, for the cook. */
export const PLAN_STOCK_NOTE =
  'Counted from the lots on hand now (not used up, not refused at the door), first to expire ' +
  'first, each batch on its start day in turn; a lot past its use-by on the day a batch starts ' +
  'does not count. Deliveries not yet received are not counted. "Arrive by" is the morning of ' +
  'the day the first batch the stock cannot cover starts, before it is made: order earlier to ' +
  'keep a day in hand.';

function weight(grams: Decimal, system: UnitSystem): PresentedWeight {
  return { amount: formatMass(grams, system), grams: grams.toString() };
}

/** An amount in its measure: a weight as the plan's sheet prints it, else as a lot is counted. */
function amountIn(value: Decimal, measure: BaseMeasure, system: UnitSystem): PresentedAmount {
  const exact = value.toString();
  return {
    amount: measure === 'g' ? formatMass(value, system) : lotAmountWords(exact, measure),
    exact,
  };
}

/** How an item's grams were turned into its measure, in words; null for a weight. */
function conversionWords(need: PlanItemNeed | undefined): string | null {
  if (!need?.weighs || need.measure === 'g') return null;
  return need.measure === 'each'
    ? `counted at ${need.weighs} for one, in whole pieces for each batch`
    : `measured at ${need.weighs}`;
}

function presentLine(
  line: PullLine,
  need: PlanItemNeed | undefined,
  titles: ReadonlyMap<string, string>,
  system: UnitSystem,
): PresentedPullLine {
  const by = line.arriveBy;
  const measure = need?.measure ?? 'g';
  return {
    item: line.item,
    name: line.name,
    measure,
    conversion: conversionWords(need),
    needed: amountIn(line.needed, measure, system),
    onHand: amountIn(line.onHand, measure, system),
    usable: amountIn(line.usable, measure, system),
    short: amountIn(line.short, measure, system),
    status: line.short.isZero() ? 'covered' : 'short',
    arriveBy: by?.date ?? null,
    arriveByWords: by
      ? `by the morning of ${weekdayDayWords(by.date)}, when ${titles.get(by.formula) ?? by.formula} starts`
      : null,
    lastFrom: line.lastFrom ?? null,
    outOfDate: line.outOfDate.map(
      (lot) =>
        `lot ${lot.lot} is past its use-by (${dayWords(lot.useBy)}) on ${dayWords(lot.neededOn)}, when it would be used: use it elsewhere first or discard it`,
    ),
    usedBy: need ? [...new Set(need.uses.map((use) => use.formula))] : [],
  };
}

function shortFirst(a: PresentedPullLine, b: PresentedPullLine): number {
  if (a.status !== b.status) return a.status === 'short' ? -1 : 1;
  return (a.arriveBy ?? '').localeCompare(b.arriveBy ?? '') || a.name.localeCompare(b.name);
}

/**
 * A plan's pull list against the lots on hand: what each catalogue item's batches need, what is
 * on hand and usable, what is short, the day more must arrive by and whom it came from last;
 * the materials that cannot be compared listed apart with the reason. Pure: the caller reads the
 * catalogue, the formulas and the lots.
 * @param formulas the formulas the plan was made from, by id
 */
export function planStock(
  plan: PlanResult,
  formulas: ReadonlyMap<string, Formula>,
  catalogue: Catalogue,
  stock: StockOnHand,
  system: UnitSystem,
): PlanStock {
  const { needs, apart } = planItemNeeds(plan, formulas, catalogue);
  const titles = new Map(plan.batches.map((batch) => [batch.formula.id, batch.formula.title]));
  const byItem = new Map(needs.map((need) => [need.item, need]));
  const lines = pullAgainstStock(needs, stock.lots, stock.lastFrom).map((line) =>
    presentLine(line, byItem.get(line.item), titles, system),
  );
  return {
    compared: true,
    asOf: plan.today,
    lines: lines.sort(shortFirst),
    apart: apart.map((line) => ({
      name: line.name,
      needed: weight(line.grams, system),
      reason: line.reason,
      why: whyApart(line.reason, line.name),
      usedBy: line.usedBy,
    })),
    note: PLAN_STOCK_NOTE,
  };
}
