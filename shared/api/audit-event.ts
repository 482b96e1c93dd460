/**
 * The audit log as GET /api/audit answers: one definition for the server that writes it and the
 * console that reads it (as types only).
 */

/** The things the audit log records. */
export const AUDIT_ACTIONS = [
  'sign-in',
  'sign-in-failed',
  'sign-in-throttled',
  'sign-out',
  'formula-save',
  'formula-create',
  'formula-upload',
  'formula-disk-change',
  'batch-record',
  'batch-status',
  'batch-sign-off',
  'batch-turn',
  'person-add',
  'person-change',
  'password-reset',
  'invitation-send',
  'reminder-choices',
  'reminder-send',
  'reading-add',
  'reading-correct',
  'readings-upload',
  'weighing-add',
  'batch-start',
  'deviation-open',
  'corrective-action',
  'batch-verify',
  'calculation-refused',
  'equipment-add',
  'equipment-change',
  'calibration-add',
  'process-alert-send',
  'report-produce',
  'plan-make',
  'plan-record',
  'batch-lots',
  'recall-produce',
  'receipt-record',
  'receipt-discard',
  'site-add',
  'site-change',
] as const;

/** One of {@link AUDIT_ACTIONS}. */
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

/** The actions whose subject is a person's username. */
export const PERSON_SUBJECTS: readonly AuditAction[] = [
  'person-add',
  'person-change',
  'password-reset',
  'invitation-send',
  'reminder-choices',
];

/** One entry of the audit log. */
export interface AuditEvent {
  readonly id: number;
  /** When it happened (ISO 8601). */
  readonly at: string;
  readonly actorId: number | null;
  /** Who did it; for a failed sign-in, the username that was tried. */
  readonly actorName: string | null;
  /** The actor's display name as it is now; null for the system or a name nobody has. */
  readonly actorDisplayName: string | null;
  readonly action: AuditAction;
  /** What it was done to: a username, a formula id or a lot code. */
  readonly subject: string | null;
  /** When the subject is a person (see {@link PERSON_SUBJECTS}), their display name now. */
  readonly subjectDisplayName: string | null;
  readonly detail: unknown;
  readonly ip: string | null;
}

/** One page of the audit log; `next` is the `before` of the following page, null at the end. */
export interface AuditPage {
  readonly events: readonly AuditEvent[];
  readonly next: number | null;
}
