import { readFile } from 'node:fs/promises';
import path from 'node:path';
import type { Transaction } from 'sequelize';
import type {
  BatchLots,
  LotOnHand,
  LotUseView,
  SuggestedItem,
} from '../../shared/api/batch-lots.ts';
import { CATALOGUE_FILE } from '../../shared/catalogue/catalogue-file.ts';
import type { Catalogue, StockUnit } from '../../shared/catalogue/catalogue-types.ts';
import { readCatalogue } from '../../shared/catalogue/read-catalogue.ts';
import { Decimal, sum } from '../../shared/decimal.ts';
import type { Formula } from '../../shared/formula/formula-types.ts';
import { baseMeasureOf, inLotUnit, type BaseMeasure } from '../../shared/stock/base-measure.ts';
import { batchNeeds, type BatchNeeds } from '../../shared/stock/batch-needs.ts';
import { suggestLots, type StockLot } from '../../shared/stock/fifo.ts';
import {
  assemblyParts,
  partNeeds,
  sourceBatchesExpired,
  sourceBatchOrder,
  suggestForNeeds,
} from '../../shared/stock/lot-suggestions.ts';
import type { AuditRepository } from '../audit/audit-repository.ts';
import type { Database } from '../db/database.ts';
import type { FormulaHistory } from '../formulas/formula-history.ts';
import { recordedBatch, type RecordedBatch } from '../process/recorded-batch.ts';
import { batchWeighings, standingWeights } from '../process/weighing-rows.ts';
import { formulaOf } from '../process/weighing-writes.ts';
import {
  receiptsOnHand,
  sourceCandidates,
  standingUses,
  stockLotOf,
  type ReceiptRow,
  type UseRow,
} from './lot-use-rows.ts';
import { datedSources, datedSourcesById, type DatedSource } from './source-use-bys.ts';
import type { SiteScope } from '../sites/site-scope.ts';

/** What lot uses work with. */
export interface LotUsesDeps {
  readonly db: Database;
  readonly audit: AuditRepository;
  readonly history: FormulaHistory;
  /** The formulas folder, where the catalogue of materials is. */
  readonly folder: string;
  /** The site of the request: the batch's own (its path is guarded), whose lots it may use. */
  readonly site?: SiteScope;
}

/** The catalogue of materials beside the formulas; undefined when there is none or it does not read. */
export async function kitchenCatalogue(folder: string): Promise<Catalogue | undefined> {
  let text: string;
  try {
    text = await readFile(path.join(folder, CATALOGUE_FILE), 'utf8');
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return undefined;
    throw error;
  }
  return readCatalogue(text, CATALOGUE_FILE).catalogue;
}

/** What a batch needs: its items from the lines weighed (or calculated), and its parts. */
export interface NeedsOf {
  readonly needs: BatchNeeds;
  readonly parts: readonly string[];
  readonly catalogue: Catalogue | undefined;
}

/** The needs of a batch, its weighings read inside the caller's transaction when given. */
export async function needsOf(
  deps: LotUsesDeps,
  batch: RecordedBatch,
  formula: Formula,
  t?: Transaction,
): Promise<NeedsOf> {
  const catalogue = await kitchenCatalogue(deps.folder);
  const weights = standingWeights(await batchWeighings(deps.db, batch.id, t));
  return {
    needs: batchNeeds(formula, batch.result, weights, catalogue),
    parts: formula.kind === 'assembly' ? assemblyParts(formula) : [],
    catalogue,
  };
}

function unitOf(text: string | null): StockUnit | null {
  const units: readonly string[] = ['g', 'kg', 'oz', 'lb', 'ml', 'l', 'each'];
  return text !== null && units.includes(text) ? (text as StockUnit) : null;
}

/** A lot use (recorded or suggested) as the API shows it. */
function useView(
  use: { item: string; amount: Decimal; usedOn: string },
  lot: {
    source: 'receipt' | 'batch';
    lotCode: string;
    itemName: string;
    supplier: string | null;
    supplierLot: string | null;
    unit: string | null;
    useBy: string | null;
  },
): LotUseView {
  const lotUnit = lot.source === 'batch' ? 'g' : unitOf(lot.unit);
  const measure: BaseMeasure = lotUnit ? baseMeasureOf(lotUnit) : 'g';
  return {
    source: lot.source,
    item: use.item,
    itemName: lot.itemName,
    lotCode: lot.lotCode,
    supplier: lot.supplier,
    supplierLot: lot.supplierLot,
    amount: use.amount.toString(),
    measure,
    lotAmount: (lotUnit ? inLotUnit(use.amount, lotUnit) : use.amount).toString(),
    lotUnit,
    useBy: lot.useBy,
    usedOn: use.usedOn,
  };
}

/**
 * A recorded lot use as the API shows it.
 * @param sources the batches drawn on, dated, by id: a batch's use-by is worked out, not kept
 */
export function recordedView(
  row: UseRow,
  sources: ReadonlyMap<number, DatedSource> = new Map(),
): LotUseView {
  const batch = row.source_batch_id !== null;
  return useView(
    { item: row.item, amount: new Decimal(row.amount), usedOn: row.used_on },
    {
      source: batch ? 'batch' : 'receipt',
      lotCode: row.lot_code,
      itemName: row.item_name ?? row.item,
      supplier: row.supplier,
      supplierLot: row.supplier_lot,
      unit: row.unit,
      useBy: batch ? (sources.get(row.source_batch_id!)?.useBy ?? null) : row.use_by,
    },
  );
}

function onHandView(row: ReceiptRow): LotOnHand {
  return {
    lotCode: row.lot_code,
    supplier: row.supplier,
    supplierLot: row.supplier_lot,
    remaining: row.remaining,
    useBy: row.use_by,
  };
}

/** A batch that may be drawn on as the lots on hand are shown: its use-by, or why it has none. */
function sourceOnHand(source: DatedSource): LotOnHand {
  return {
    lotCode: source.lotCode,
    supplier: null,
    supplierLot: null,
    remaining: null,
    useBy: source.useBy ?? null,
    madeOn: source.finishedOn,
    ...(source.noUseBy ? { noUseBy: source.noUseBy } : {}),
  };
}

/** The usable lots of an item first to expire first: suggestLots asked for all there is. */
function firstToExpire(lots: readonly StockLot[], item: string, usedOn: string): StockLot[] {
  const all = sum(lots.filter((lot) => lot.item === item).map((lot) => lot.remaining));
  return suggestLots(lots, item, all, usedOn).takes.map((take) => take.lot);
}

/**
 * The suggestion for a batch on its day of use: per item, the lots first to expire first and any
 * shortfall; per assembly part, the batches of its formula best first, and the part's finished
 * weight from the first of them (the cook may change the batch, or split it over several).
 */
export async function suggestionFor(
  deps: LotUsesDeps,
  batch: RecordedBatch,
  of: NeedsOf,
  t?: Transaction,
): Promise<SuggestedItem[]> {
  const usedOn = batch.startedOn;
  const rows = await receiptsOnHand(
    deps.db,
    of.needs.items.map((need) => need.item),
    usedOn,
    t,
    deps.site,
  );
  const byCode = new Map(rows.map((row) => [row.lot_code, row]));
  const lots = rows.map(stockLotOf);
  const items = suggestForNeeds(of.needs, lots, usedOn).map(
    ({ need, takes, shortfall, expired }): SuggestedItem => ({
      item: need.item,
      name: need.name,
      source: 'receipt',
      unit: need.unit,
      measure: need.measure,
      need: need.amount?.toString() ?? null,
      grams: need.grams.toString(),
      weighs: need.measure === 'g' ? null : (need.weighs ?? null),
      weighed: need.weighed,
      takes: takes.map(({ lot, take }) => {
        const row = byCode.get(lot.lot)!;
        return useView(
          { item: need.item, amount: take, usedOn },
          {
            source: 'receipt',
            lotCode: row.lot_code,
            itemName: row.item_name,
            supplier: row.supplier,
            supplierLot: row.supplier_lot,
            unit: row.unit,
            useBy: row.use_by,
          },
        );
      }),
      shortfall: shortfall?.toString() ?? null,
      expired: expired.map((lot) => onHandView(byCode.get(lot.lot)!)),
      onHand: firstToExpire(lots, need.item, usedOn).map((lot) => onHandView(byCode.get(lot.lot)!)),
    }),
  );
  if (of.parts.length === 0) return items;
  const candidates = await datedSources(
    deps.history,
    await sourceCandidates(deps.db, of.parts, usedOn, t, deps.site),
  );
  const needs = partNeeds(batch.result);
  const parts = of.parts.map((part): SuggestedItem => {
    const order = sourceBatchOrder(candidates, part, batch.lotCode, usedOn);
    const expired = sourceBatchesExpired(candidates, part, batch.lotCode, usedOn);
    const line = batch.result.groups.flatMap((g) => g.lines).find((l) => l.part === part);
    const title = candidates.find((c) => c.formulaId === part)?.title ?? line?.name ?? part;
    const need = needs.get(part);
    const first = order[0];
    return {
      item: part,
      name: title,
      source: 'batch',
      unit: 'g',
      measure: 'g',
      need: need?.toString() ?? null,
      grams: null,
      weighs: null,
      weighed: false,
      takes:
        need && first
          ? [
              useView(
                { item: part, amount: need, usedOn },
                {
                  source: 'batch',
                  lotCode: first.lotCode,
                  itemName: first.title,
                  supplier: null,
                  supplierLot: null,
                  unit: null,
                  useBy: first.useBy ?? null,
                },
              ),
            ]
          : [],
      shortfall: null,
      expired: expired.map(sourceOnHand),
      onHand: order.map(sourceOnHand),
    };
  });
  return [...items, ...parts];
}

/** A batch that has used nothing yet: planned, not started. */
function canRecord(batch: RecordedBatch): boolean {
  return batch.status !== 'planned';
}

/**
 * GET /api/batches/:lot/lots: the lots the batch used, or, when none are recorded, the lots
 * suggested for it; and its lines that no catalogue item is linked to.
 * @throws RecordsError 'not-found'; AppError 409 'formula-unavailable'
 */
export async function batchLots(deps: LotUsesDeps, lot: string): Promise<BatchLots> {
  const batch = await recordedBatch(deps.db, lot);
  const formula = await formulaOf(deps.history, batch);
  const of = await needsOf(deps, batch, formula);
  const uses = await standingUses(deps.db, batch.id);
  const sources = await datedSourcesById(
    deps.db,
    deps.history,
    uses.flatMap((use) => (use.source_batch_id === null ? [] : [use.source_batch_id])),
  );
  return {
    lotCode: batch.lotCode,
    usedOn: batch.startedOn,
    uses: uses.map((use) => recordedView(use, sources)),
    // Once lots are recorded nothing is suggested, but what is on hand stays, to change them by.
    suggested: (await suggestionFor(deps, batch, of)).map((item) =>
      uses.length ? { ...item, takes: [], shortfall: null } : item,
    ),
    notInCatalogue: of.needs.unlinked.map((line) => ({
      name: line.name,
      grams: line.grams.toString(),
    })),
    canRecord: canRecord(batch),
  };
}
