import type {
  FormulaKind,
  PresentedResult,
  RawBatchOptions,
  UnitSystem,
} from '../../shared/index.ts';

/** Where a batch is: planned → in progress → curing/proofing → done, or discarded with a reason. */
export type BatchStatus = 'planned' | 'in-progress' | 'curing' | 'proofing' | 'done' | 'discarded';

/** Every status, in the order of the work. */
export const BATCH_STATUSES: readonly BatchStatus[] = [
  'planned',
  'in-progress',
  'curing',
  'proofing',
  'done',
  'discarded',
];

/** The statuses a batch may be recorded with. */
export const RECORD_STATUSES = ['planned', 'in-progress'] as const;

/** The moves each status allows; done and discarded are final. */
export const TRANSITIONS: Readonly<Record<BatchStatus, readonly BatchStatus[]>> = {
  planned: ['in-progress', 'discarded'],
  'in-progress': ['curing', 'proofing', 'done', 'discarded'],
  curing: ['done', 'discarded'],
  proofing: ['done', 'discarded'],
  done: [],
  discarded: [],
};

/** The only kind each holding status applies to: cures cure, doughs proof. */
const HOLD_KIND: Partial<Record<BatchStatus, FormulaKind>> = { curing: 'cure', proofing: 'dough' };

/** Why a move is not allowed, in words; undefined when it is allowed. */
export function refusedMove(
  from: BatchStatus,
  to: BatchStatus,
  kind: FormulaKind,
): string | undefined {
  if (TRANSITIONS[from].length === 0) return `a ${from} batch is final; its status cannot change`;
  if (!TRANSITIONS[from].includes(to))
    return `a batch cannot go from ${from} to ${to}; from ${from} it can go to ${TRANSITIONS[from].join(' or ')}`;
  const kindNeeded = HOLD_KIND[to];
  if (kindNeeded && kind !== kindNeeded)
    return `only a ${kindNeeded} batch can be ${to}; this is a ${kind}`;
  return undefined;
}

/** The statuses in which a batch cannot be signed off: nothing has been made, or it was thrown away. */
export const UNSIGNABLE_STATUSES: readonly BatchStatus[] = ['planned', 'discarded'];

/** Someone named on a batch: its operator, its reviewer, who changed it. */
export interface PersonRef {
  readonly id: number;
  readonly displayName: string;
}

/** One thing that happened to a batch; batches are never changed without one. */
export interface BatchEvent {
  readonly type: 'recorded' | 'status' | 'sign-off' | 'note';
  /** ISO timestamp. */
  readonly at: string;
  readonly by: PersonRef | null;
  readonly from: BatchStatus | null;
  readonly to: BatchStatus | null;
  /** Why: the discard reason, a status note, the reviewer's note. */
  readonly reason: string | null;
}

/** A batch without its full result: what the log lists and the CSV export writes. */
export interface BatchSummary {
  /** Readable and unique, YYMMDD-XX-NN: start date, formula initials, the day's sequence. */
  readonly lotCode: string;
  /** The formula as it was when the batch was calculated; revision is the file's sha-256. */
  readonly formula: { readonly id: string; readonly revision: string; readonly title: string };
  readonly kind: FormulaKind;
  readonly status: BatchStatus;
  readonly operator: PersonRef;
  /** ISO date the batch starts (the calculation's start). */
  readonly startedOn: string;
  /** ISO date it is ready, when the calculation gave one. */
  readonly readyOn: string | null;
  readonly recordedAt: string;
  readonly updatedAt: string;
  readonly units: UnitSystem;
  /** The batch options it was calculated from, as sent (the start date filled in). */
  readonly inputs: RawBatchOptions;
  /** Whether no limit check failed. A failed critical limit is never recorded at all. */
  readonly checksPassed: boolean;
  /** Cures only: the exact ingoing sodium nitrite, ppm of green weight, as a decimal string. */
  readonly nitritePpm: string | null;
  readonly signedOff: { readonly by: PersonRef; readonly at: string } | null;
  readonly discardReason: string | null;
  readonly notes: string | null;
}

/** A recorded batch with the result computed when it was recorded, and its events when read alone. */
export interface Batch extends BatchSummary {
  /** The presented result: what the cook's sheet showed, exact values as strings. */
  readonly result: PresentedResult;
  /** Oldest first; present on a single batch, absent in lists. */
  readonly events?: readonly BatchEvent[];
}

/** What is stored for a new batch; the lot code and times are added when it is written. */
export interface NewBatch {
  readonly formula: { readonly id: string; readonly revision: string; readonly title: string };
  readonly kind: FormulaKind;
  readonly status: (typeof RECORD_STATUSES)[number];
  readonly operatorId: number;
  readonly startedOn: string;
  readonly readyOn: string | null;
  readonly units: UnitSystem;
  readonly inputs: RawBatchOptions;
  readonly result: PresentedResult;
  readonly checksPassed: boolean;
  readonly nitritePpm: string | null;
  readonly notes: string | null;
}

/** Who makes a change, for the batch event and the audit log. */
export interface BatchActor {
  readonly id: number;
  readonly username: string;
}

/** How a change is written: by whom, from where, and (for demo history only) when. */
export interface ChangeOptions {
  readonly actor: BatchActor;
  readonly ip?: string;
  /** ISO timestamp of the change; now unless demo history is being written. */
  readonly at?: string;
  /** Whether to append to the audit log; only the demo seed, writing history, turns it off. */
  readonly audit?: boolean;
}
