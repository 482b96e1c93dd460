import type { Database } from '../db/database.ts';
import { indexedBy } from '../db/dialect-sql.ts';
import { readRow, readRows } from '../db/read-row.ts';
import { planNotePattern } from '../plans/plan-repository.ts';
import { andSite, type SiteScope } from '../sites/site-scope.ts';

/** A batch as costing reads it. */
export interface CostBatchRow {
  id: number;
  lot_code: string;
  formula_id: string;
  formula_title: string;
  started_on: string;
  notes: string | null;
  /** The presented result, as JSON. */
  result: string;
}

/** A lot a batch drew on, with the receipt's price or the earlier batch it was. */
export interface LotUseRow {
  batch_id: number;
  item: string;
  amount: string;
  receipt_id: number | null;
  receipt_lot: string | null;
  item_name: string | null;
  unit: string | null;
  unit_cost: string | null;
  source_batch_id: number | null;
  source_lot: string | null;
}

/** A delivery's price: per unit received, in that unit. */
export interface PriceRow {
  unit: string;
  unit_cost: string;
}

/** What is on hand of one item: the lots not used up, added up in the base measure. */
export interface OnHandRow {
  item: string;
  remaining: string;
}

/** The most batches a formula's cost chart draws: the latest ones. */
export const COST_POINTS = 200;

const BATCH_COLUMNS = 'id, lot_code, formula_id, formula_title, started_on, notes, result';

/**
 * The reads costing needs, each on an index: a batch by lot code (its UNIQUE index), a formula's
 * latest batches (batches_formula), a batch's lot uses (lot_uses_batch) with their receipts and
 * earlier batches by primary key, an item's latest price (receipts_latest_price, 016) and the lots
 * on hand (receipts_on_hand). With a site, the batches, prices and lots of that site only (a
 * batch's lot uses and the earlier batches it was made from are read by id, as recorded).
 */
export class CostRepository {
  constructor(
    private readonly db: Database,
    private readonly site?: SiteScope,
  ) {}

  /** The same reads kept to one site's records. */
  at(site: SiteScope): CostRepository {
    return new CostRepository(this.db, site);
  }

  /** ` AND column = ?` for the site, or nothing (one site, or none given). */
  private atSite(column = 'site_id') {
    return andSite(this.site, column);
  }

  batch(lot: string): Promise<CostBatchRow | undefined> {
    const site = this.atSite();
    return readRow<CostBatchRow>(
      this.db.sequelize,
      `SELECT ${BATCH_COLUMNS} FROM batches WHERE lot_code = ?${site.sql}`,
      [lot, ...site.values],
    );
  }

  batchById(id: number): Promise<CostBatchRow | undefined> {
    return readRow<CostBatchRow>(
      this.db.sequelize,
      `SELECT ${BATCH_COLUMNS} FROM batches WHERE id = ?`,
      [id],
    );
  }

  /**
   * A formula's batches that were made (not planned, not discarded), the latest COST_POINTS + 1
   * newest first, so the caller knows whether there were more.
   */
  formulaBatches(formula: string): Promise<CostBatchRow[]> {
    const site = this.atSite();
    return readRows<CostBatchRow>(
      this.db.sequelize,
      `SELECT ${BATCH_COLUMNS} FROM batches${indexedBy(this.db.dialect, 'batches_formula')}
       WHERE formula_id = ? AND status NOT IN ('planned', 'discarded')${site.sql}
       ORDER BY recorded_at DESC, id DESC LIMIT ?`,
      [formula, ...site.values, COST_POINTS + 1],
    );
  }

  /**
   * The batches recorded from a plan for a menu item and day of service, not discarded; not the
   * menu item's own batch, which is those batches put together (its cost would count them twice).
   */
  planBatches(assembly: string, serviceDate: string): Promise<CostBatchRow[]> {
    const site = this.atSite();
    return readRows<CostBatchRow>(
      this.db.sequelize,
      `SELECT ${BATCH_COLUMNS} FROM batches WHERE notes LIKE ? AND status <> 'discarded'
         AND formula_id <> ?${site.sql} ORDER BY started_on, id`,
      [planNotePattern(assembly, serviceDate), assembly, ...site.values],
    );
  }

  /** The lots a batch drew on, in the order recorded (not those recorded again: corrected). */
  lotUses(batchId: number): Promise<LotUseRow[]> {
    return readRows<LotUseRow>(
      this.db.sequelize,
      `SELECT u.batch_id, u.item, u.amount, u.receipt_id, r.lot_code AS receipt_lot, r.item_name,
         r.unit, r.unit_cost, u.source_batch_id, s.lot_code AS source_lot
       FROM lot_uses u
       LEFT JOIN receipts r ON r.id = u.receipt_id
       LEFT JOIN batches s ON s.id = u.source_batch_id
       WHERE u.batch_id = ? AND u.replaced_at IS NULL ORDER BY u.id`,
      [batchId],
    );
  }

  /**
   * An item's latest price on a day: the newest delivery of it with a price received on or before
   * that day, else (a batch older than any priced delivery) the newest of all.
   */
  async latestPrice(item: string, day: string): Promise<PriceRow | undefined> {
    const site = this.atSite();
    const sql = (upTo: boolean) =>
      `SELECT unit, unit_cost FROM receipts${indexedBy(this.db.dialect, 'receipts_latest_price')}
       WHERE item = ? AND unit_cost IS NOT NULL AND decision <> 'refused'${site.sql}
       ${upTo ? 'AND received_on <= ?' : ''}
       ORDER BY received_on DESC, received_at DESC, id DESC LIMIT 1`;
    return (
      (await readRow<PriceRow>(this.db.sequelize, sql(true), [item, ...site.values, day])) ??
      readRow<PriceRow>(this.db.sequelize, sql(false), [item, ...site.values])
    );
  }

  /** What is on hand of the given items: the lots neither used up nor refused. */
  async onHand(items: readonly string[]): Promise<OnHandRow[]> {
    if (items.length === 0) return [];
    const site = this.atSite();
    const rows = await readRows<{ item: string; remaining: string }>(
      this.db.sequelize,
      `SELECT item, remaining FROM receipts${indexedBy(this.db.dialect, 'receipts_on_hand')}
       WHERE item IN (${items.map(() => '?').join(', ')})
         AND emptied_on IS NULL AND decision <> 'refused'${site.sql}`,
      [...items, ...site.values],
    );
    return rows;
  }
}
