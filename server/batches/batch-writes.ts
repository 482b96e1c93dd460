import { andSite, siteIdOf } from '../sites/site-scope.ts';
import { QueryTypes, type Transaction } from 'sequelize';
import { insertNew } from '../db/insert-row.ts';
import { appendChange } from '../audit/append-change.ts';
import type { AuditRepository } from '../audit/audit-repository.ts';
import type { Database } from '../db/database.ts';
import {
  moveRefusal,
  signOffNoteRefusal,
  signOffRefusal,
  type WorkflowRefusal,
  type WorkflowRules,
} from '../../shared/workflow/workflow-rules.ts';
import { AppError, badRequest, conflict, notFound } from '../http/app-error.ts';
import type { BatchEvent, BatchStatus } from '../../shared/api/batch-record.ts';
import type { PresentedResult } from '../../shared/presentation/presented-result.ts';
import { UNSIGNABLE_STATUSES, refusedMove } from '../../shared/workflow/batch-status.ts';
import { doneRefusal } from '../../shared/workflow/release-rules.ts';
import type { ChangeOptions, NewBatch } from './batch.ts';
import { MAX_LOT_SEQUENCE, lotCode, lotPrefix, prefixRange } from './lot-code.ts';
import { dayWords } from '../../shared/presentation/date-words.ts';

/** A workflow rule's refusal as the API's error; a missing reason names its field. */
function ruleError(refusal: WorkflowRefusal): AppError {
  return new AppError(
    refusal.status,
    refusal.code,
    refusal.message,
    refusal.code === 'reason-needed' || refusal.code === 'note-needed'
      ? [{ field: refusal.code === 'reason-needed' ? 'reason' : 'note', message: refusal.message }]
      : [],
  );
}

/** The columns a change looks at before it is made. */
export interface CurrentRow {
  id: number;
  status: BatchStatus;
  kind: NewBatch['kind'];
  operator_id: number;
  signed_off_at: string | null;
}

/**
 * The changes to batches, each made inside a write transaction the caller holds: the row, a
 * batch event and (unless writing demo history) an audit entry, always together. Every path
 * that changes a batch (the API, the demo seed, the command line) comes through here, so the
 * kitchen's workflow rules are checked here.
 */
export class BatchWrites {
  constructor(
    private readonly db: Database,
    private readonly audit: AuditRepository,
    private readonly rules: WorkflowRules,
  ) {}

  private async select<T extends object>(
    t: Transaction,
    sql: string,
    values: unknown[],
  ): Promise<T[]> {
    return this.db.sequelize.query<T>(sql, {
      replacements: values,
      type: QueryTypes.SELECT,
      transaction: t,
    });
  }

  private async run(t: Transaction, sql: string, values: unknown[]): Promise<void> {
    await this.db.sequelize.query(sql, { replacements: values, transaction: t });
  }

  /** Appends a batch event: nothing changes a batch without one. */
  async event(
    t: Transaction,
    batchId: number,
    at: string,
    options: ChangeOptions,
    event: Pick<BatchEvent, 'type' | 'from' | 'to' | 'reason'>,
  ): Promise<void> {
    await this.run(
      t,
      'INSERT INTO batch_events (batch_id, at, actor_id, type, from_status, to_status, reason) VALUES (?, ?, ?, ?, ?, ?, ?)',
      [batchId, at, options.actor.id, event.type, event.from, event.to, event.reason],
    );
  }

  /**
   * Inserts a batch under the next free lot code of its start day and formula initials, found
   * in this same transaction (BEGIN IMMEDIATE holds the write lock, so no other record can take
   * it meanwhile). Returns the lot code.
   */
  async insert(t: Transaction, batch: NewBatch, options: ChangeOptions): Promise<string> {
    const at = options.at ?? new Date().toISOString();
    const prefix = lotPrefix(batch.startedOn, batch.formula.id);
    const [low, high] = prefixRange(prefix);
    const [last] = await this.select<{ n: number | null }>(
      t,
      'SELECT MAX(CAST(substr(lot_code, ?) AS INTEGER)) AS n FROM batches WHERE lot_code >= ? AND lot_code < ?',
      [prefix.length + 1, low, high],
    );
    const sequence = (last?.n ?? 0) + 1;
    if (sequence > MAX_LOT_SEQUENCE)
      throw conflict(
        'lot-codes-exhausted',
        `${MAX_LOT_SEQUENCE} batches of ${batch.formula.title} already start on ${dayWords(batch.startedOn)}`,
      );
    const lot = lotCode(prefix, sequence);
    const id = await insertNew(
      this.db,
      `INSERT INTO batches (lot_code, formula_id, formula_revision, formula_title, kind, status,
         operator_id, started_on, ready_on, recorded_at, updated_at, units, inputs, result,
         checks_passed, nitrite_ppm, notes, planned_by, site_id)
       VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
      [
        lot,
        batch.formula.id,
        batch.formula.revision,
        batch.formula.title,
        batch.kind,
        batch.status,
        batch.operatorId,
        batch.startedOn,
        batch.readyOn,
        at,
        at,
        batch.units,
        JSON.stringify(batch.inputs),
        JSON.stringify(batch.result),
        batch.checksPassed ? 1 : 0,
        batch.nitritePpm,
        batch.notes,
        // Who recorded it as planned: kept when it is started, by them or someone else.
        batch.status === 'planned' ? batch.operatorId : null,
        siteIdOf(options.site),
      ],
      t,
    );
    await this.event(t, id, at, options, {
      type: 'recorded',
      from: null,
      to: batch.status,
      reason: null,
    });
    await appendChange(this.audit, t, options, 'batch-record', lot, {
      formula: batch.formula.id,
      revision: batch.formula.revision,
      status: batch.status,
      checksPassed: batch.checksPassed,
      ...(batch.nitritePpm === null ? {} : { nitritePpm: batch.nitritePpm }),
    });
    return lot;
  }

  /** The batch a change names, at the change's site: another site's is not found. */
  private async current(t: Transaction, lot: string, options: ChangeOptions): Promise<CurrentRow> {
    const site = andSite(options.site, 'site_id');
    const [row] = await this.select<CurrentRow>(
      t,
      `SELECT id, status, kind, operator_id, signed_off_at FROM batches WHERE lot_code = ?${site.sql}`,
      [lot, ...site.values],
    );
    if (!row) throw notFound(`no batch with lot code ${lot}`);
    return row;
  }

  /**
   * The batch, once the move to `to` is found allowed (the status machine, the workflow rules).
   * @throws AppError 404 no such lot, 409 'bad-transition'; the rules' refusals
   */
  async mayMove(
    t: Transaction,
    lot: string,
    to: BatchStatus,
    reason: string | null,
    options: ChangeOptions,
  ): Promise<CurrentRow> {
    const batch = await this.current(t, lot, options);
    const refused =
      batch.status === to
        ? `the batch is already ${to}`
        : refusedMove(batch.status, to, batch.kind);
    if (refused) throw conflict('bad-transition', refused, [{ from: batch.status, to }]);
    const rule = moveRefusal(
      { kind: batch.kind, status: batch.status, signedOff: batch.signed_off_at !== null },
      to,
      { role: options.actor.role, reason },
      this.rules,
    );
    if (rule) throw ruleError(rule);
    return batch;
  }

  /**
   * Moves a batch along the allowed moves, under the workflow rules; discarding needs a reason.
   * @throws AppError 400 discarding without a reason, 404 no such lot, 409 'bad-transition';
   *   the rules' 403 'signed-off', 400 'reason-needed', 409 'not-cured'; 409 'on-hold' (done
   *   while a deviation is open)
   */
  async move(
    t: Transaction,
    lot: string,
    to: BatchStatus,
    reason: string | null,
    options: ChangeOptions,
  ): Promise<void> {
    if (to === 'discarded' && !reason?.trim())
      throw badRequest('discarding a batch needs a reason', [
        { field: 'reason', message: 'is needed to discard a batch' },
      ]);
    const at = options.at ?? new Date().toISOString();
    const batch = await this.mayMove(t, lot, to, reason, options);
    const signedOff = batch.signed_off_at !== null;
    // A batch with a missed critical limit not yet corrected is on hold: it cannot be finished.
    if (to === 'done') {
      const [open] = await this.select<{ n: number }>(
        t,
        `SELECT COUNT(*) AS n FROM deviations d WHERE d.batch_id = ? AND NOT EXISTS
           (SELECT 1 FROM corrective_actions a WHERE a.deviation_id = d.id)`,
        [batch.id],
      );
      const onHold = doneRefusal(open?.n ?? 0);
      if (onHold) throw new AppError(onHold.status, onHold.code, onHold.message);
    }
    await this.run(
      t,
      `UPDATE batches SET status = ?, updated_at = ?,
         discard_reason = CASE WHEN ? = 'discarded' THEN ? ELSE discard_reason END
       WHERE id = ?`,
      [to, at, to, reason, batch.id],
    );
    await this.event(t, batch.id, at, options, { type: 'status', from: batch.status, to, reason });
    await appendChange(this.audit, t, options, 'batch-status', lot, {
      from: batch.status,
      to,
      ...(reason ? { reason } : {}),
      // An admin changing a reviewed record stands out in the audit log.
      ...(signedOff ? { afterSignOff: true } : {}),
    });
  }

  /**
   * Records the reviewer's sign-off, once; planned and discarded batches cannot be signed off,
   * nor (under the rules) a batch by the person who recorded it; a batch with a failed check, or
   * still curing, only with a note.
   * @throws AppError 404 no such lot, 409 'already-signed-off' or 'not-signable', 403 'own-batch',
   *   400 'note-needed'
   */
  async signOff(
    t: Transaction,
    lot: string,
    note: string | null,
    options: ChangeOptions,
  ): Promise<void> {
    const at = options.at ?? new Date().toISOString();
    const batch = await this.current(t, lot, options);
    if (batch.signed_off_at !== null)
      throw conflict('already-signed-off', `batch ${lot} was signed off at ${batch.signed_off_at}`);
    if (UNSIGNABLE_STATUSES.includes(batch.status))
      throw conflict('not-signable', `a ${batch.status} batch cannot be signed off`, [
        { status: batch.status },
      ]);
    const rule = signOffRefusal({ operatorId: batch.operator_id }, options.actor, this.rules);
    if (rule) throw ruleError(rule);
    const noteNeeded = signOffNoteRefusal(
      { status: batch.status, failedChecks: await this.failedChecks(t, batch.id) },
      note,
    );
    if (noteNeeded) throw ruleError(noteNeeded);
    await this.run(
      t,
      'UPDATE batches SET signed_off_by = ?, signed_off_at = ?, updated_at = ? WHERE id = ?',
      [options.actor.id, at, at, batch.id],
    );
    await this.event(t, batch.id, at, options, {
      type: 'sign-off',
      from: null,
      to: null,
      reason: note,
    });
    await appendChange(this.audit, t, options, 'batch-sign-off', lot, {
      status: batch.status,
      ...(note ? { note } : {}),
    });
  }

  /** The labels of a batch's failed checks, as its recorded result has them. */
  private async failedChecks(t: Transaction, batchId: number): Promise<string[]> {
    const [row] = await this.select<{ checks_passed: number; result: string }>(
      t,
      'SELECT checks_passed, result FROM batches WHERE id = ?',
      [batchId],
    );
    if (!row || row.checks_passed === 1) return [];
    const { checks } = JSON.parse(row.result) as Pick<PresentedResult, 'checks'>;
    return checks.filter((check) => check.status === 'fail').map((check) => check.label);
  }
}
