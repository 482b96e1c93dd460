import { QueryTypes, type Transaction } from 'sequelize';
import type { Deviation, Disposition } from '../../shared/api/process-record.ts';
import { parseMass } from '../../shared/units/mass.ts';
import { QuantityError } from '../../shared/units/quantity-error.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import { insertRow } from '../db/insert-row.ts';
import { AppError, notFound } from '../http/app-error.ts';
import type { ProcessDeps } from './judge-and-open.ts';
import { refuseOnReleased } from './released.ts';

/** What happened to the product after a deviation. source: 9 CFR 417.3(a)(4) (product disposition) */
export const DISPOSITIONS: readonly Disposition[] = [
  'recooked',
  'rechilled',
  'reworked',
  'diverted',
  'discarded',
];

/** Dispositions that take product out of the batch: how much must be said. */
const AMOUNT_NEEDED: readonly Disposition[] = ['diverted', 'discarded'];

/**
 * A corrective action as POST /api/deviations/:id/action takes it: the four things of
 * 9 CFR 417.3(a) — the cause found and eliminated, the CCP under control again, measures against
 * a recurrence, and what happened to the product.
 */
export interface ActionRequest {
  readonly cause: string;
  readonly restored: string;
  readonly prevention: string;
  readonly disposition: Disposition;
  /** How much product, e.g. "4.2 kg"; needed when diverted or discarded. */
  readonly grams?: string;
  /** Why an earlier action is replaced; needed for a second action. */
  readonly reason?: string;
}

const FIELD_WORDS = {
  cause: 'the cause of the deviation',
  restored: 'how the critical control point is under control again',
  prevention: 'what keeps it from happening again',
} as const;

function refused(field: string, message: string): AppError {
  return new AppError(422, 'bad-action', message, [{ field, message }]);
}

/** The amount in grams as a decimal string, or null. @throws AppError 422 */
function gramsOf(request: ActionRequest): string | null {
  const text = request.grams?.trim();
  if (!text) {
    if (AMOUNT_NEEDED.includes(request.disposition))
      throw refused('grams', `say how much product was ${request.disposition}`);
    return null;
  }
  try {
    const grams = /^\d+(\.\d+)?$/.test(text) ? parseMass(`${text} g`) : parseMass(text);
    if (grams.lte(0)) throw refused('grams', 'the amount of product must be more than nothing');
    return grams.toFixed();
  } catch (error) {
    if (error instanceof QuantityError) throw refused('grams', error.message);
    throw error;
  }
}

/**
 * Checks the four things of a corrective action and gives the amount of product in grams (null
 * when none is said).
 * @throws AppError 422 'bad-action': a blank text, a disposition not known, no amount
 */
export function checkAction(request: ActionRequest): string | null {
  for (const field of ['cause', 'restored', 'prevention'] as const)
    if (!request[field]?.trim()) throw refused(field, `say ${FIELD_WORDS[field]}`);
  if (!DISPOSITIONS.includes(request.disposition))
    throw refused('disposition', `say what happened to the product: ${DISPOSITIONS.join(', ')}`);
  return gramsOf(request);
}

/** One corrective action to write: what it closes, the four things, what it replaces. */
export interface NewAction {
  readonly deviationId: number;
  /** The lot code or equipment name, for the audit log. */
  readonly subject: string;
  readonly cause: string;
  readonly restored: string;
  readonly prevention: string;
  readonly disposition: Disposition;
  readonly grams: string | null;
  /** The standing action it replaces, and why; null for the first. */
  readonly replaces: number | null;
  readonly reason: string | null;
}

/**
 * Writes a corrective action and its audit entry in the caller's write. `by` is null when the
 * server records it (a deadline the readings showed was met).
 */
export async function writeAction(
  deps: ProcessDeps,
  t: Transaction,
  action: NewAction,
  by: ChangeOptions | null,
  at: string,
): Promise<void> {
  const { lastId } = await insertRow(
    deps.db,
    t,
    `INSERT INTO corrective_actions (deviation_id, cause, restored, prevention, disposition,
       disposition_grams, recorded_by, recorded_at, corrects_id, reason)
     VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
    [
      action.deviationId,
      action.cause,
      action.restored,
      action.prevention,
      action.disposition,
      action.grams,
      by?.actor.id ?? null,
      at,
      action.replaces,
      action.replaces === null ? null : action.reason,
    ],
  );
  await deps.audit.append(
    {
      actor: by?.actor ?? null,
      action: 'corrective-action',
      subject: action.subject,
      detail: {
        deviation: action.deviationId,
        action: lastId,
        disposition: action.disposition,
        ...(action.grams === null ? {} : { grams: action.grams }),
        ...(action.replaces === null ? {} : { replaces: action.replaces, reason: action.reason }),
      },
      ...(by?.ip === undefined ? {} : { ip: by.ip }),
    },
    t,
  );
}

/**
 * Closes, in the caller's write, a deadline deviation that the readings as they now stand show
 * was not missed: readings taken before the deadline were entered after it, and the deviation was
 * opened on the record as it was then. It stays on the record, closed by the server with the
 * reason and the product marked unaffected; nothing is deleted.
 */
export async function closeAsMet(
  deps: ProcessDeps,
  t: Transaction,
  deviation: { readonly id: number; readonly subject: string; readonly key: string },
  control: { readonly title: string },
  at: string,
): Promise<void> {
  // A cooling deadline's key ends in its stage: "batch 12/chill/stage-1".
  const stage = /\/stage-(\d+)$/.exec(deviation.key)?.[1];
  const what = stage ? `stage ${stage} of ${control.title}` : control.title;
  await writeAction(
    deps,
    t,
    {
      deviationId: deviation.id,
      subject: deviation.subject,
      cause: `Readings of ${control.title} taken before the deadline were entered after it had passed; the deviation was opened on the record as it stood then.`,
      restored: `The readings as they now stand show ${what} reached by its deadline.`,
      // source: 9 CFR 417.5(b): each entry on a HACCP record is made at the time the event occurs
      prevention:
        'Enter each reading when it is taken, so the record shows it as the work goes on.',
      disposition: 'unaffected',
      grams: null,
      replaces: null,
      reason: null,
    },
    null,
    at,
  );
}

interface DeviationAt {
  id: number;
  batch_id: number | null;
  /** What it concerns: the batch's lot code, or the piece of equipment's name. */
  subject: string | null;
  standing: number | null;
}

/**
 * Records the corrective action that closes a deviation. A second action replaces the standing
 * one (which stays, as an earlier action) and needs a reason.
 * @throws AppError 404 no such deviation; 409 released (its batch); 422 bad-action (a blank text, no amount), reason-needed
 */
export async function recordAction(
  deps: ProcessDeps,
  deviationId: number,
  request: ActionRequest,
  by: ChangeOptions,
): Promise<Deviation> {
  const grams = checkAction(request);
  const at = by.at ?? new Date().toISOString();
  return deps.db.write(async (t) => {
    const [deviation] = await deps.db.sequelize.query<DeviationAt>(
      `SELECT d.id, d.batch_id, COALESCE(b.lot_code, e.name, r.lot_code) AS subject,
         (SELECT a.id FROM corrective_actions a WHERE a.deviation_id = d.id AND NOT EXISTS
           (SELECT 1 FROM corrective_actions c WHERE c.corrects_id = a.id)) AS standing
       FROM deviations d LEFT JOIN batches b ON b.id = d.batch_id
         LEFT JOIN equipment e ON e.id = d.equipment_id
         LEFT JOIN receipts r ON r.id = d.receipt_id WHERE d.id = ?`,
      { replacements: [deviationId], type: QueryTypes.SELECT, transaction: t },
    );
    if (!deviation?.subject) throw notFound(`no deviation ${deviationId}`);
    if (deviation.batch_id !== null)
      await refuseOnReleased(deps.db, t, { id: deviation.batch_id, lotCode: deviation.subject });
    const reason = request.reason?.trim() || null;
    if (deviation.standing !== null && !reason)
      throw new AppError(
        422,
        'reason-needed',
        'this deviation has a corrective action already; say why it is replaced',
        [{ field: 'reason', message: 'is needed to replace a corrective action' }],
      );
    await writeAction(
      deps,
      t,
      {
        deviationId,
        subject: deviation.subject,
        cause: request.cause.trim(),
        restored: request.restored.trim(),
        prevention: request.prevention.trim(),
        disposition: request.disposition,
        grams,
        replaces: deviation.standing,
        reason,
      },
      by,
      at,
    );
    const { key: _key, ...closed } = (await deps.process.deviation(deviationId, t))!;
    return closed;
  });
}
