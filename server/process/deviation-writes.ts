import type { Transaction } from 'sequelize';
import type { DeviationKind } from '../../shared/api/process-record.ts';
import type { AuditRepository } from '../audit/audit-repository.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import type { Database } from '../db/database.ts';
import { insertRow } from '../db/insert-row.ts';

/** A missed limit to record against a batch or a piece of equipment. */
export interface DeviationToOpen {
  readonly batchId: number | null;
  readonly equipmentId?: number | null;
  /** The delivery it is about: one taken in over its receiving limit. */
  readonly receiptId?: number | null;
  /** The lot code or equipment name, for the audit log. */
  readonly subject: string;
  readonly control: string | null;
  readonly kind: DeviationKind;
  /** Words for a cook: what was missed, by how much, when. */
  readonly what: string;
  readonly readingId?: number | null;
  /**
   * Names this miss exactly ("batch 12/chill/stage-1", "batch 12/nitrite/weighing 40"): a miss
   * already opened, by this process or another, is not opened again.
   */
  readonly key: string;
  /** When it was found, if not `by.at` or now: the deadline scan's own clock. */
  readonly openedAt?: string;
}

/**
 * Opens a deviation inside the caller's write transaction, once: the UNIQUE dedupe key makes a
 * second open of the same miss a no-op, across restarts and processes. Returns its id, or null
 * when it was already open. `by` is null when the server found it (a deadline passed).
 */
export async function openDeviation(
  db: Database,
  audit: AuditRepository,
  t: Transaction,
  deviation: DeviationToOpen,
  by: ChangeOptions | null,
): Promise<number | null> {
  const at = deviation.openedAt ?? by?.at ?? new Date().toISOString();
  const inserted = await insertRow(
    db,
    t,
    `INSERT INTO deviations (batch_id, equipment_id, receipt_id, control, kind, what, opened_at, opened_by, reading_id, dedupe_key)
     VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?) ON CONFLICT (dedupe_key) DO NOTHING`,
    [
      deviation.batchId,
      deviation.equipmentId ?? null,
      deviation.receiptId ?? null,
      deviation.control,
      deviation.kind,
      deviation.what,
      at,
      by?.actor.id ?? null,
      deviation.readingId ?? null,
      deviation.key,
    ],
  );
  if (inserted.changes === 0) return null;
  if (by?.audit !== false)
    await audit.append(
      {
        actor: by?.actor ?? null,
        action: 'deviation-open',
        subject: deviation.subject,
        detail: {
          deviation: inserted.lastId,
          control: deviation.control,
          kind: deviation.kind,
          what: deviation.what,
        },
        ...(by?.ip === undefined ? {} : { ip: by.ip }),
      },
      t,
    );
  return inserted.lastId;
}
