/**
 * The kitchen's workflow rules around sign-off and curing, which a food-safety reviewer expects:
 * data and pure functions, no I/O, so the server enforces them and the console explains them
 * from one definition. The server's settings turn each rule off; every rule is on by default.
 */
import type { BatchStatus } from '../api/batch-record.ts';
import type { FormulaKind } from '../formula/formula-types.ts';

/** Which rules hold; each is on unless the kitchen turns it off (server/README.md, "Settings"). */
export interface WorkflowRules {
  /** The person who recorded a batch cannot sign it off (separation of duties). */
  readonly separateSignOff: boolean;
  /** A signed-off batch changes status only by an admin who gives a reason. */
  readonly lockSignedOff: boolean;
  /** A cure reaches done only through curing, never straight from in progress. */
  readonly cureBeforeDone: boolean;
}

/** Every rule on: what a kitchen gets unless it says otherwise. */
export const SAFE_WORKFLOW_RULES: WorkflowRules = {
  separateSignOff: true,
  lockSignedOff: true,
  cureBeforeDone: true,
};

/** Why a rule refuses a change: the API's status and stable code, and words for a cook. */
export interface WorkflowRefusal {
  readonly status: 400 | 403 | 409;
  readonly code: 'own-batch' | 'signed-off' | 'reason-needed' | 'not-cured' | 'note-needed';
  /** In a cook's words, as the API's message and the console's explanation alike. */
  readonly message: string;
}

/** What the rules look at of a batch. */
export interface WorkflowBatch {
  readonly kind: FormulaKind;
  readonly status: BatchStatus;
  readonly signedOff: boolean;
  /** Who recorded it. */
  readonly operatorId: number;
}

/** Who asks for a change. */
export interface WorkflowPerson {
  readonly id: number;
  readonly role: 'admin' | 'cook' | 'reviewer';
}

/**
 * Why this person may not sign this batch off under the rules; undefined when they may. Roles,
 * statuses and a second sign-off are the server's own checks, not rules a kitchen sets.
 */
export function signOffRefusal(
  batch: Pick<WorkflowBatch, 'operatorId'>,
  signer: Pick<WorkflowPerson, 'id'>,
  rules: WorkflowRules,
): WorkflowRefusal | undefined {
  if (rules.separateSignOff && batch.operatorId === signer.id)
    return {
      status: 403,
      code: 'own-batch',
      message: 'you recorded this batch; another person signs it off',
    };
  return undefined;
}

/** What a sign-off looks at of a batch beyond who recorded it: its status and failed checks. */
export interface SignedBatch {
  readonly status: BatchStatus;
  /** The labels of the checks that failed, as recorded ("Ingoing sodium nitrite"); empty if none. */
  readonly failedChecks: readonly string[];
}

/**
 * What the reviewer signs for on a batch that is not plainly good, in a cook's words: its failed
 * checks named, or that it is still curing; null for a batch that passed and has finished curing.
 * Such a sign-off always needs a note, whatever the kitchen's rules: the record must say what
 * the reviewer looked at.
 */
export function signOffConcern(batch: SignedBatch): string | null {
  const named = batch.failedChecks.map((label) => `“${label}”`);
  const failed =
    named.length === 0
      ? null
      : named.length === 1
        ? `the check ${named[0]} failed`
        : `the checks ${named.slice(0, -1).join(', ')} and ${named.at(-1)} failed`;
  const curing = batch.status === 'curing' ? 'it is still curing' : null;
  const both = [failed, curing].filter((part): part is string => part !== null);
  return both.length ? both.join(', and ') : null;
}

/**
 * Why this sign-off may not be made without a note: a failed check or a batch still curing needs
 * the reviewer to say what they checked; undefined when the note is there or not needed.
 */
export function signOffNoteRefusal(
  batch: SignedBatch,
  note: string | null,
): WorkflowRefusal | undefined {
  const concern = signOffConcern(batch);
  if (!concern || note?.trim()) return undefined;
  return {
    status: 400,
    code: 'note-needed',
    message: `${concern}; say in the note what you checked before signing it off`,
  };
}

/**
 * Why this person may not move this batch to `to` under the rules; undefined when they may.
 * Only moves the status machine allows are asked about (TRANSITIONS in batch-status.ts).
 * @param mover who moves it, and the reason they give (null for none)
 */
export function moveRefusal(
  batch: Omit<WorkflowBatch, 'operatorId'>,
  to: BatchStatus,
  mover: Pick<WorkflowPerson, 'role'> & { readonly reason: string | null },
  rules: WorkflowRules,
): WorkflowRefusal | undefined {
  if (rules.lockSignedOff && batch.signedOff) {
    if (mover.role !== 'admin')
      return {
        status: 403,
        code: 'signed-off',
        message: 'this batch is signed off; only an admin can change its status now, with a reason',
      };
    if (!mover.reason?.trim())
      return {
        status: 400,
        code: 'reason-needed',
        message: 'this batch is signed off; say why its status changes',
      };
  }
  // Curing is the step the nitrite needs time for; skipping it leaves no record that it cured.
  if (
    rules.cureBeforeDone &&
    batch.kind === 'cure' &&
    batch.status === 'in-progress' &&
    to === 'done'
  )
    return {
      status: 409,
      code: 'not-cured',
      message: 'a cure is done only after curing; start curing first',
    };
  return undefined;
}
