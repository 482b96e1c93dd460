import type { Sequelize } from 'sequelize';
import type {
  LotMeasure,
  LotUse,
  TraceAnswer,
  TraceSearch,
} from '../../shared/api/trace-record.ts';
import type { TracedLot } from '../../shared/api/trace-record.ts';
import { dialectOf } from '../db/dialect-sql.ts';
import { readRows } from '../db/read-row.ts';
import { RecordsError } from '../records/records-error.ts';
import { tracedBatch, tracedReceipt } from './trace-lots.ts';
import {
  BACK_USES_SQL,
  BATCH_BY_LOT_SQL,
  BATCHES_BY_ID_SQL,
  FORWARD_USES_SQL,
  MOST_LEVELS,
  RECEIPT_BY_LOT_SQL,
  RECEIPTS_BY_ID_SQL,
  RECEIPTS_BY_SUPPLIER_LOT_SQL,
  type BatchRow,
  type DialectSql,
  type ReceiptRow,
  type UseRow,
} from './trace-sql.ts';
import { splitBySite, type TraceSites } from './trace-sites.ts';
import { buildTree, type LotKey, type TraceEdge } from './trace-tree.ts';

/** A lot found by its code: a received lot or a batch, with its row. */
export type FoundLot =
  | { readonly kind: 'receipt'; readonly row: ReceiptRow }
  | { readonly kind: 'batch'; readonly row: BatchRow };

/** The roots of a trace forward: received lots and batches, by row id. */
export interface ForwardRoots {
  readonly receipts: readonly ReceiptRow[];
  readonly batches: readonly BatchRow[];
}

/** The most characters a lot code or supplier lot may have: more is not a lot. */
const LONGEST_CODE = 80;

function notFound(message: string): RecordsError {
  return new RecordsError('not-found', 'not-found', message);
}

/** The lots a walk reached, as shown, and the site id of each. */
interface ReadLots {
  readonly lots: Map<LotKey, TracedLot>;
  readonly siteOf: Map<LotKey, number>;
}

/**
 * Reads traces from the records: trace back from a batch, trace forward from received lots or a
 * batch, each walk one recursive query whose every step is an index lookup (trace-sql.ts), then
 * the lots it reached by their primary keys. Given the sites of a request (several-site
 * installs), its roots are the request's site's only and the lots of sites the asker has no role
 * at are cut off (trace-sites.ts); the queries stay the same, so their plans do.
 */
export class TraceReader {
  constructor(
    private readonly sequelize: Sequelize,
    private readonly sites?: TraceSites,
  ) {}

  /** Whether a root's row is at the request's site (always, without sites). */
  private atSite(row: { site_id: number }): boolean {
    return !this.sites || Number(row.site_id) === this.sites.at;
  }

  /** A lot as shown: with its site's key when the trace keeps to sites. */
  private shown(kind: 'r', row: ReceiptRow): TracedLot;
  private shown(kind: 'b', row: BatchRow): TracedLot;
  private shown(kind: 'r' | 'b', row: ReceiptRow | BatchRow): TracedLot {
    const site = this.sites?.seen.get(Number(row.site_id));
    return kind === 'r'
      ? tracedReceipt(row as ReceiptRow, site)
      : tracedBatch(row as BatchRow, site);
  }

  private rows<T>(sql: string | DialectSql, values: readonly (string | number)[]): Promise<T[]> {
    const text = typeof sql === 'string' ? sql : sql[dialectOf(this.sequelize)];
    return readRows<T>(this.sequelize, text, values);
  }

  /** A received lot or a batch by the code on its label, in either case. */
  async findLot(code: string): Promise<FoundLot> {
    const wanted = code.trim().toUpperCase();
    if (wanted && wanted.length <= LONGEST_CODE) {
      // Another site's lot is not found, in the same words as one that does not exist.
      const [receipt] = await this.rows<ReceiptRow>(RECEIPT_BY_LOT_SQL, [wanted]);
      if (receipt) {
        if (this.atSite(receipt)) return { kind: 'receipt', row: receipt };
      } else {
        const [batch] = await this.rows<BatchRow>(BATCH_BY_LOT_SQL, [wanted]);
        if (batch && this.atSite(batch)) return { kind: 'batch', row: batch };
      }
    }
    throw notFound(`no received lot or batch with lot code ${code.trim()}`);
  }

  /** Every receipt of a supplier's lot, of one supplier when named; not found when none. */
  async supplierLot(supplierLot: string, supplier?: string): Promise<ReceiptRow[]> {
    const lot = supplierLot.trim();
    const who = supplier?.trim() || null;
    const rows =
      lot && lot.length <= LONGEST_CODE
        ? (
            await this.rows<ReceiptRow>(RECEIPTS_BY_SUPPLIER_LOT_SQL, [lot, who] as string[])
          ).filter((row) => this.atSite(row))
        : [];
    if (rows.length === 0)
      throw notFound(`no delivery of supplier lot ${lot}${who ? ` from ${who}` : ''} was received`);
    return rows;
  }

  /** The roots a search names, for a trace forward or a recall. */
  async forwardRoots(search: TraceSearch): Promise<ForwardRoots> {
    if ('supplierLot' in search)
      return { receipts: await this.supplierLot(search.supplierLot, search.supplier), batches: [] };
    const found = await this.findLot(search.lot);
    return found.kind === 'receipt'
      ? { receipts: [found.row], batches: [] }
      : { receipts: [], batches: [found.row] };
  }

  /** Everything that went into a lot, through every level: a received lot has nothing behind it. */
  async back(lot: string): Promise<TraceAnswer> {
    const found = await this.findLot(lot);
    const searched = { lot: found.row.lot_code };
    if (found.kind === 'receipt') {
      const root = { lot: this.shown('r', found.row), level: 0, children: [] };
      return { direction: 'back', searched, roots: [root], batches: 0, incomplete: false };
    }
    const uses = await this.rows<UseRow>(BACK_USES_SQL, [found.row.id, MOST_LEVELS]);
    const edges = uses.map((u): TraceEdge => ({
      from: `b${u.batch_id}`,
      to: u.receipt_id === null ? `b${u.source_batch_id ?? 0}` : `r${u.receipt_id}`,
      use: { item: u.item, amount: u.amount, measure: 'g', usedOn: u.used_on },
    }));
    const read = await this.lotsOf(edges, [], [found.row]);
    const tree = buildTree({ roots: [`b${found.row.id}`], ...this.keptToSites(edges, read) });
    return { direction: 'back', searched, ...tree };
  }

  /** Everywhere the roots went: every batch that used them, through batches made from batches. */
  async forward(searched: TraceSearch, roots: ForwardRoots): Promise<TraceAnswer> {
    const receiptIds = JSON.stringify(roots.receipts.map((r) => r.id));
    const batchIds = JSON.stringify(roots.batches.map((b) => b.id));
    const uses = await this.rows<UseRow>(FORWARD_USES_SQL, [receiptIds, batchIds, MOST_LEVELS]);
    const edges = uses.map((u): TraceEdge => ({
      from: u.receipt_id === null ? `b${u.source_batch_id ?? 0}` : `r${u.receipt_id}`,
      to: `b${u.batch_id}`,
      use: { item: u.item, amount: u.amount, measure: 'g', usedOn: u.used_on },
    }));
    const read = await this.lotsOf(edges, roots.receipts, roots.batches);
    const keys: LotKey[] = [
      ...roots.receipts.map((r): LotKey => `r${r.id}`),
      ...roots.batches.map((b): LotKey => `b${b.id}`),
    ];
    const tree = buildTree({ roots: keys, ...this.keptToSites(edges, read) });
    // A lot asked for in any case is named as its label has it.
    const root = roots.receipts[0] ?? roots.batches[0];
    const named = 'lot' in searched && root ? { lot: root.lot_code } : searched;
    return { direction: 'forward', searched: named, ...tree };
  }

  /**
   * The links measured, and without the lots of sites the asker has no role at: those are
   * counted on the lot that links to them (`elsewhere`), never named.
   */
  private keptToSites(
    edges: readonly TraceEdge[],
    { lots, siteOf }: ReadLots,
  ): { edges: TraceEdge[]; lots: Map<LotKey, TracedLot>; elsewhere?: Map<LotKey, LotUse[]> } {
    const all = measured(edges, lots);
    if (!this.sites) return { edges: all, lots };
    const { shown, elsewhere } = splitBySite(all, siteOf, this.sites);
    return { edges: shown, lots, elsewhere };
  }

  /** Every lot the links name, read by primary key, with the rows already at hand. */
  private async lotsOf(
    edges: readonly TraceEdge[],
    receipts: readonly ReceiptRow[],
    batches: readonly BatchRow[],
  ): Promise<ReadLots> {
    const lots = new Map<LotKey, TracedLot>();
    const siteOf = new Map<LotKey, number>();
    const keep = (key: LotKey, lot: TracedLot, row: { site_id: number }): void => {
      lots.set(key, lot);
      siteOf.set(key, Number(row.site_id));
    };
    for (const r of receipts) keep(`r${r.id}`, this.shown('r', r), r);
    for (const b of batches) keep(`b${b.id}`, this.shown('b', b), b);
    const wanted = (prefix: 'r' | 'b'): number[] => [
      ...new Set(
        edges
          .flatMap((e) => [e.from, e.to])
          .filter((key) => key.startsWith(prefix) && !lots.has(key))
          .map((key) => Number(key.slice(1))),
      ),
    ];
    const receiptRows = await this.rows<ReceiptRow>(RECEIPTS_BY_ID_SQL, [
      JSON.stringify(wanted('r')),
    ]);
    for (const r of receiptRows) keep(`r${r.id}`, this.shown('r', r), r);
    const batchRows = await this.rows<BatchRow>(BATCHES_BY_ID_SQL, [JSON.stringify(wanted('b'))]);
    for (const b of batchRows) keep(`b${b.id}`, this.shown('b', b), b);
    return { lots, siteOf };
  }
}

/**
 * The links with their amounts in the received lot's measure (millilitres, a count); a batch
 * used in another is weighed, in grams.
 */
function measured(edges: readonly TraceEdge[], lots: ReadonlyMap<LotKey, TracedLot>): TraceEdge[] {
  return edges.map((edge) => {
    const received = [edge.from, edge.to].find((key) => key.startsWith('r'));
    const lot = received && lots.get(received);
    const measure: LotMeasure = lot && lot.kind === 'receipt' ? lot.measure : 'g';
    return measure === edge.use.measure ? edge : { ...edge, use: { ...edge.use, measure } };
  });
}
