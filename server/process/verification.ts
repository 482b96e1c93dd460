import { QueryTypes } from 'sequelize';
import type { Verification } from '../../shared/api/process-record.ts';
import type { WorkflowRules } from '../../shared/workflow/workflow-rules.ts';
import { verifyRefusal } from '../../shared/workflow/release-rules.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import { insertRow } from '../db/insert-row.ts';
import { AppError, conflict } from '../http/app-error.ts';
import { controlClosed } from './judge-batch.ts';
import { judgeAndOpen, type ProcessDeps } from './judge-and-open.ts';

/**
 * Records the pre-shipment review of a batch's records (9 CFR 417.5(c)), which releases it: only
 * a finished batch, nothing on hold, every control met or its misses closed by corrective
 * actions, and (under the separate sign-off rule) not by the person who recorded it. Judged in
 * the same write, so a miss found now (a deadline just passed) holds the batch instead.
 * @throws AppError 404; 409 not-finished, on-hold, controls-open, already-verified; 403 own-batch
 */
export async function verifyBatch(
  deps: ProcessDeps,
  lot: string,
  note: string | null,
  rules: WorkflowRules,
  by: ChangeOptions,
): Promise<Verification> {
  const at = by.at ?? new Date().toISOString();
  const found = await deps.process.batch(lot);
  const controls = await deps.process.controlsOf(found);
  const refusal = await deps.db.write(async (t) => {
    const batch = await deps.process.batch(lot, t);
    const [already] = await deps.db.sequelize.query<{ id: number }>(
      'SELECT id FROM verifications WHERE batch_id = ? LIMIT 1',
      { replacements: [batch.id], type: QueryTypes.SELECT, transaction: t },
    );
    if (already)
      throw conflict('already-verified', `batch ${lot} was verified and released already`);
    // Misses found now are opened (and committed) even when the verification is refused.
    const judgement = await judgeAndOpen(deps, t, batch, controls, at, by);
    const deviations = await deps.process.deviations(batch.id, t);
    const closedKeys = new Set(deviations.filter((d) => d.action !== null).map((d) => d.key));
    const refused = verifyRefusal(
      {
        status: batch.status,
        operatorId: batch.operatorId,
        openDeviations: deviations.filter((d) => d.action === null).length,
        openControls: judgement.controls
          .filter((c) => !controlClosed(batch.id, c, closedKeys))
          .map((c) => c.control.title),
      },
      by.actor,
      rules,
    );
    if (refused) return refused;
    const { lastId: verificationId } = await insertRow(
      deps.db,
      t,
      'INSERT INTO verifications (batch_id, note, recorded_by, recorded_at) VALUES (?, ?, ?, ?)',
      [batch.id, note, by.actor.id, at],
    );
    // The batch's own history shows the release beside its sign-off.
    await deps.db.sequelize.query(
      `INSERT INTO batch_events (batch_id, at, actor_id, type, from_status, to_status, reason)
       VALUES (?, ?, ?, 'note', NULL, NULL, ?)`,
      {
        replacements: [
          batch.id,
          at,
          by.actor.id,
          `Records verified; released${note ? `: ${note}` : ''}`,
        ],
        transaction: t,
      },
    );
    await deps.audit.append(
      {
        actor: by.actor,
        action: 'batch-verify',
        subject: lot,
        detail: { verification: verificationId, ...(note ? { note } : {}) },
        ...(by.ip === undefined ? {} : { ip: by.ip }),
      },
      t,
    );
    return undefined;
  });
  if (refusal) throw new AppError(refusal.status, refusal.code, refusal.message);
  return (await deps.process.verification(found.id))!;
}
