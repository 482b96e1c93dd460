import { andSite, type SiteScope } from '../sites/site-scope.ts';
import { QueryTypes, type Transaction } from 'sequelize';
import type { WorkflowRules } from '../../shared/workflow/workflow-rules.ts';
import type { AuditRepository } from '../audit/audit-repository.ts';
import type { Database } from '../db/database.ts';
import { readRows } from '../db/read-row.ts';
import { notFound } from '../http/app-error.ts';
import type { Batch, BatchPage, BatchStatus, BatchSummary } from '../../shared/api/batch-record.ts';
import type { ChangeOptions, NewBatch } from './batch.ts';
import { encodeCursor, type BatchFilter, type ListQuery } from './batch-query.ts';
import {
  BATCHES_WITH_PEOPLE,
  SUMMARY_COLUMNS,
  toBatch,
  toEvent,
  toListItem,
  toSummary,
  type BatchEventRow,
  type BatchRow,
} from './batch-rows.ts';
import { countSql, pageSql } from './batch-sql.ts';
import { recordTurn, turnsOf } from './batch-turns.ts';
import { BatchWrites } from './batch-writes.ts';

/**
 * The most batches a page counts for its total; beyond, the total reads "1000+". Measured on a
 * log of a million batches: counting 1,000 matches of a formula and a status takes a few
 * milliseconds, 10,000 took 150–250 ms (each match's row is read to test the second column).
 */
export const TOTAL_COUNTED = 1000;

/** How often a record is tried again when another writer took its lot code first. */
const LOT_ATTEMPTS = 5;

type SortedRow = BatchRow & { sort_key: string | number };

function isLotConflict(error: unknown): boolean {
  const e = error as { name?: string; fields?: unknown; parent?: { message?: string } };
  return (
    e.name === 'SequelizeUniqueConstraintError' &&
    (JSON.stringify(e.fields ?? '').includes('lot_code') ||
      (e.parent?.message ?? '').includes('lot_code'))
  );
}

/**
 * Recorded batches and their events. Every change is one write transaction that updates the
 * batch, appends a batch event and appends to the audit log; nothing is updated without an event
 * and nothing is ever deleted. Returns plain objects.
 */
export class BatchRepository {
  /** The same changes inside a transaction the caller holds, without reading the batch back. */
  readonly writes: BatchWrites;

  /** @param rules the kitchen's workflow rules, which every change is held to */
  constructor(
    private readonly db: Database,
    private readonly audit: AuditRepository,
    /** The kitchen's workflow rules, which release is held to as well. */
    readonly rules: WorkflowRules,
  ) {
    this.writes = new BatchWrites(db, audit, rules);
  }

  /** One write transaction (queued and retried while busy by the database itself). */
  private write<T>(work: (transaction: Transaction) => Promise<T>): Promise<T> {
    return this.db.write(work);
  }

  /** Rows of a read: inside a write transaction through it, otherwise straight from SQLite. */
  private select<T extends object>(
    sql: string,
    values: readonly (string | number)[],
    transaction?: Transaction,
  ): Promise<T[]> {
    if (!transaction) return readRows<T>(this.db.sequelize, sql, values);
    return this.db.sequelize.query<T>(sql, {
      replacements: [...values],
      type: QueryTypes.SELECT,
      transaction,
    });
  }

  /**
   * Stores a calculated batch under the next free lot code of its day and formula, with its
   * 'recorded' event and audit entry, in one write transaction. Should another process take the
   * lot code first, the UNIQUE index refuses the insert and the record is tried again.
   */
  async record(batch: NewBatch, options: ChangeOptions): Promise<Batch> {
    for (let attempt = 1; ; attempt++) {
      try {
        return await this.write(async (t) =>
          this.mustGet(await this.writes.insert(t, batch, options), t),
        );
      } catch (error) {
        if (attempt >= LOT_ATTEMPTS || !isLotConflict(error)) throw error;
      }
    }
  }

  /**
   * Stores several calculated batches in one write transaction, all or nothing (a plan's
   * batches): each under the next free lot code of its day and formula, with its 'recorded'
   * event and audit entry. Retried whole when another process took a lot code first.
   * `around` runs in the same write: `before` may refuse (throw) before anything is written,
   * `after` is given the batches recorded (a plan noted as recorded).
   */
  async recordAll(
    batches: readonly NewBatch[],
    options: ChangeOptions,
    around: {
      before?: (t: Transaction) => Promise<void>;
      after?: (t: Transaction, recorded: readonly Batch[]) => Promise<void>;
    } = {},
  ): Promise<Batch[]> {
    for (let attempt = 1; ; attempt++) {
      try {
        return await this.write(async (t) => {
          await around.before?.(t);
          const recorded: Batch[] = [];
          for (const batch of batches) {
            recorded.push(await this.mustGet(await this.writes.insert(t, batch, options), t));
          }
          await around.after?.(t, recorded);
          return recorded;
        });
      } catch (error) {
        if (attempt >= LOT_ATTEMPTS || !isLotConflict(error)) throw error;
      }
    }
  }

  /**
   * Moves a batch to another status along the allowed moves and under the workflow rules, with
   * an event and an audit entry.
   * `alongside` runs in the same write after the move (the process record judged as finished).
   * @throws AppError 404 no such lot, 409 'bad-transition', 400 discarding without a reason;
   *   the rules' 403 'signed-off', 400 'reason-needed', 409 'not-cured', 409 'on-hold'
   */
  changeStatus(
    lot: string,
    to: BatchStatus,
    reason: string | null,
    options: ChangeOptions,
    alongside?: (transaction: Transaction) => Promise<void>,
  ): Promise<Batch> {
    return this.write(async (t) => {
      await this.writes.move(t, lot, to, reason, options);
      await alongside?.(t);
      return this.mustGet(lot, t);
    });
  }

  /**
   * Records the reviewer's sign-off, once, with an event and an audit entry.
   * @throws AppError 404 no such lot, 409 'already-signed-off' or 'not-signable', 403 'own-batch'
   */
  signOff(lot: string, note: string | null, options: ChangeOptions): Promise<Batch> {
    return this.write(async (t) => {
      await this.writes.signOff(t, lot, note, options);
      return this.mustGet(lot, t);
    });
  }

  /**
   * Records that a curing batch was turned today, with an audit entry, in one write.
   * @throws AppError 404 no such lot; 409 'discarded', 'released', 'not-curing', 'already-turned'
   */
  turn(lot: string, note: string | null, options: ChangeOptions): Promise<Batch> {
    return this.write(async (t) => {
      await recordTurn(this.db, this.audit, t, lot, note, options);
      return this.mustGet(lot, t);
    });
  }

  /**
   * One batch with its events, oldest first; undefined when there is no such lot at the site
   * (another site's batch is not found; no site: any).
   */
  async get(lot: string, transaction?: Transaction, site?: SiteScope): Promise<Batch | undefined> {
    const atSite = andSite(site, 'b.site_id');
    const [row] = await this.select<BatchRow>(
      `SELECT ${SUMMARY_COLUMNS}, b.result FROM ${BATCHES_WITH_PEOPLE} WHERE b.lot_code = ?${atSite.sql}`,
      [lot, ...atSite.values],
      transaction,
    );
    if (!row) return undefined;
    const events = await this.select<BatchEventRow>(
      `SELECT e.id, e.at, e.actor_id, p.display_name AS actor_name, e.type, e.from_status,
         e.to_status, e.reason
       FROM batch_events e LEFT JOIN people p ON p.id = e.actor_id
       WHERE e.batch_id = ? ORDER BY e.id`,
      [row.id],
      transaction,
    );
    return toBatch(row, events.map(toEvent), await turnsOf(this.db, row.id, transaction));
  }

  private async mustGet(lot: string, transaction?: Transaction): Promise<Batch> {
    const batch = await this.get(lot, transaction);
    if (!batch) throw notFound(`no batch with lot code ${lot}`);
    return batch;
  }

  /** How many batches match a filter (all of them by default). */
  async count(filter: BatchFilter = {}): Promise<number> {
    const { sql, values } = countSql(filter, undefined, this.db.dialect);
    const [row] = await this.select<{ n: number | string }>(sql, values);
    // PostgreSQL's COUNT is a bigint, which pg gives as text.
    return Number(row.n);
  }

  /** How many batches match, counting no further than upTo + 1 (see TOTAL_COUNTED). */
  async countUpTo(filter: BatchFilter, upTo: number): Promise<{ total: number; exact: boolean }> {
    const { sql, values } = countSql(filter, upTo, this.db.dialect);
    const [row] = await this.select<{ n: number | string }>(sql, values);
    const n = Number(row.n);
    return n > upTo ? { total: upTo, exact: false } : { total: n, exact: true };
  }

  /** One page of the log: list items (no full result), cursors either side, the total. */
  async list(query: ListQuery): Promise<BatchPage> {
    const { sql, values } = pageSql(query, 'list', this.db.dialect);
    const rows = await this.select<SortedRow>(sql, values);
    const more = rows.length > query.limit;
    const page = rows.slice(0, query.limit);
    const backwards = query.cursor?.direction === 'prev';
    if (backwards) page.reverse();
    const cursorAt = (row: SortedRow | undefined, direction: 'next' | 'prev'): string | null =>
      row
        ? encodeCursor(query.sort, query.order, { key: row.sort_key, id: row.id, direction })
        : null;
    const first = page[0];
    const last = page[page.length - 1];
    // A first page that holds every match has its count already.
    const { total, exact } =
      !query.cursor && !more
        ? { total: page.length, exact: true }
        : await this.countUpTo(query.filter, TOTAL_COUNTED);
    return {
      items: page.map(toListItem),
      // Backwards, the page we came from lies ahead; forwards, the one we came from lies behind.
      next: backwards || more ? cursorAt(last, 'next') : null,
      prev: backwards
        ? more
          ? cursorAt(first, 'prev')
          : null
        : query.cursor
          ? cursorAt(first, 'prev')
          : null,
      total,
      totalExact: exact,
    };
  }

  /**
   * Every batch a query matches, as summaries (no result), `pageSize` at a time along the same
   * keyset as the list, so an export of any size holds one page in memory.
   */
  async *summaryPages(
    query: Omit<ListQuery, 'limit' | 'cursor'>,
    pageSize = 500,
  ): AsyncGenerator<BatchSummary[]> {
    let page: ListQuery = { ...query, limit: pageSize };
    for (;;) {
      const { sql, values } = pageSql(page, 'summary', this.db.dialect);
      const rows = await this.select<SortedRow>(sql, values);
      const kept = rows.slice(0, pageSize);
      if (kept.length > 0) yield kept.map(toSummary);
      if (rows.length <= pageSize) return;
      const last = kept[kept.length - 1];
      page = { ...page, cursor: { key: last.sort_key, id: last.id, direction: 'next' } };
    }
  }
}
