import { componentLabel } from '../calculation/blend/blend-fat.ts';
import type { BatchMaterial, PlanBatch, PlanResult } from '../calculation/plan/plan-types.ts';
import { greenMeatName } from '../calculation/plan/pull-list.ts';
import type { Catalogue, CatalogueItem } from '../catalogue/catalogue-types.ts';
import { itemNamed, linkLines } from '../catalogue/link-catalogue.ts';
import type { Decimal } from '../decimal.ts';
import type { Formula } from '../formula/formula-types.ts';
import { sameName } from '../labels/ingredient-statement.ts';
import { itemWeightOf } from '../catalogue/item-weight.ts';
import { baseMeasureOf, gramsToBase, type BaseMeasure } from './base-measure.ts';
import type { ApartReason } from './plan-stock-types.ts';
import type { ItemNeed, ItemUse } from './pull-list.ts';

/** A material of the plan listed apart from the comparison with stock, added up by name. */
export interface ApartMaterial {
  /** As the formulas name it (first spelling met). */
  readonly name: string;
  /** Grams to pull: before trimming where a trim yield applies. */
  readonly grams: Decimal;
  /** The formula ids that use it. */
  readonly usedBy: readonly string[];
  readonly reason: ApartReason;
}

/** What a plan needs of one item, with the measure its amounts are in. */
export interface PlanItemNeed extends ItemNeed {
  /** Grams, millilitres or pieces. */
  readonly measure: BaseMeasure;
  /** The catalogue's weight per unit the grams were turned by ("50 g"), for an item not weighed. */
  readonly weighs?: string;
}

/** A plan's materials by catalogue item, with what cannot be compared with stock apart. */
export interface PlanItemNeeds {
  /**
   * Items compared with stock, in catalogue order: stocked by weight (grams), or by count or
   * volume with a weight per unit in the catalogue (pieces, rounded up batch by batch, or
   * millilitres).
   */
  readonly needs: readonly PlanItemNeed[];
  /** In name order. */
  readonly apart: readonly ApartMaterial[];
}

function reasonApart(item: CatalogueItem | undefined): ApartReason | undefined {
  if (!item) return 'no-item';
  if (item.kind === 'water') return 'tap-water';
  // Weighed in grams: an item stocked by count or volume is compared through its weight per unit.
  if (baseMeasureOf(item.unit) === 'g' || itemWeightOf(item)) return undefined;
  return item.unit === 'each' ? 'by-count' : 'by-volume';
}

/** The catalogue index of each material line of a formula, by the line's name. */
function linkedNames(formula: Formula | undefined, catalogue: Catalogue): Map<string, number> {
  const byName = new Map<string, number>();
  if (!formula) return byName;
  for (const { line, index } of linkLines(formula, catalogue)) {
    if (index === undefined) continue;
    const names = [line.name];
    // A blend's batch names its trims with their fat: "chuck trim 85/15 (15 % fat)".
    if (formula.kind === 'blend' && line.path[0] === 'components') {
      names.push(componentLabel(formula.components[line.path[1] as number]));
    }
    for (const name of names) if (!byName.has(sameName(name))) byName.set(sameName(name), index);
  }
  // A cure's green meat is no line of the formula: its meat_item names the item it is drawn from.
  if (formula.kind === 'cure' && formula.meat_item !== undefined) {
    const meat = catalogue.items.findIndex((item) => item.key === formula.meat_item);
    if (meat >= 0) byName.set(sameName(greenMeatName(formula.title)), meat);
  }
  return byName;
}

/**
 * What a plan's batches need of each catalogue item, batch by batch with each batch's start day,
 * in the item's base measure (grams; pieces or millilitres through the catalogue's weight per
 * unit, a batch's pieces rounded up to whole ones; see gramsToBase), from the
 * batches' own materials (the pull list before it is added up). A material links to the item its
 * formula line names (by `item:` or by name, as `larder check` links it), else to the one item
 * its name matches (a brine's water, which is no line of its own). What to pull is the weight
 * before trimming where a trim yield applies.
 * @param formulas the plan's formulas by id (the library it was made from)
 */
export function planItemNeeds(
  plan: PlanResult,
  formulas: ReadonlyMap<string, Formula>,
  catalogue: Catalogue,
): PlanItemNeeds {
  // Grams by item and batch: a batch's lines of one item are turned into pieces together.
  const uses = new Map<number, { name: string; uses: Map<PlanBatch, ItemUse> }>();
  const apart = new Map<
    string,
    { material: BatchMaterial; grams: Decimal; usedBy: string[]; reason: ApartReason }
  >();
  for (const batch of plan.batches) {
    const linked = linkedNames(formulas.get(batch.formula.id), catalogue);
    for (const material of batch.materials) {
      const index = linked.get(sameName(material.name)) ?? itemNamed(catalogue, material.name);
      const item = index === undefined ? undefined : catalogue.items[index];
      const amount = material.beforeTrimGrams ?? material.grams;
      const reason = reasonApart(item);
      if (reason === undefined && item && index !== undefined) {
        const found = uses.get(index) ?? { name: material.name, uses: new Map() };
        const use = found.uses.get(batch);
        found.uses.set(batch, {
          start: batch.start,
          amount: use ? use.amount.plus(amount) : amount,
          formula: batch.formula.id,
        });
        uses.set(index, found);
        continue;
      }
      const key = `${reason}|${sameName(material.name)}`;
      const known = apart.get(key);
      if (!known) {
        apart.set(key, {
          material,
          grams: amount,
          usedBy: [batch.formula.id],
          reason: reason ?? 'no-item',
        });
        continue;
      }
      known.grams = known.grams.plus(amount);
      if (!known.usedBy.includes(batch.formula.id)) known.usedBy.push(batch.formula.id);
    }
  }
  return {
    needs: [...uses]
      .sort(([a], [b]) => a - b)
      .map(([index, { name, uses: byBatch }]) => {
        const item = catalogue.items[index];
        const measure = baseMeasureOf(item.unit);
        return {
          item: item.key,
          name,
          measure,
          ...(measure !== 'g' && item.weighs ? { weighs: item.weighs } : {}),
          // Each batch's grams turned on their own: a batch cracks whole eggs.
          uses: [...byBatch.values()].map((use) => ({
            ...use,
            amount: gramsToBase(use.amount, item, false)!,
          })),
        };
      }),
    apart: [...apart.values()]
      .map(({ material, grams, usedBy, reason }) => ({
        name: material.name,
        grams,
        usedBy,
        reason,
      }))
      .sort((a, b) => a.name.localeCompare(b.name)),
  };
}
