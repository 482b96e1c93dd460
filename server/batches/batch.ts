import type { BatchStatus } from '../../shared/api/batch-record.ts';
import type { Role } from '../people/person.ts';
import type {
  BatchKind,
  PresentedResult,
  RawBatchOptions,
  UnitSystem,
} from '../../shared/index.ts';

export type {
  Batch,
  BatchEvent,
  BatchListItem,
  BatchPage,
  BatchStatus,
  BatchSummary,
  PersonRef,
} from '../../shared/api/batch-record.ts';

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
const HOLD_KIND: Partial<Record<BatchStatus, BatchKind>> = { curing: 'cure', proofing: 'dough' };

/** Why a move is not allowed, in words; undefined when it is allowed. */
export function refusedMove(
  from: BatchStatus,
  to: BatchStatus,
  kind: BatchKind,
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

/** What is stored for a new batch; the lot code and times are added when it is written. */
export interface NewBatch {
  readonly formula: { readonly id: string; readonly revision: string; readonly title: string };
  readonly kind: BatchKind;
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

/** Who makes a change, for the batch event and the audit log; the role for the workflow rules. */
export interface BatchActor {
  readonly id: number;
  readonly username: string;
  readonly role: Role;
}

/** How a change is written: by whom, from where, and (for demo history only) when. */
export interface ChangeOptions {
  readonly actor: BatchActor;
  readonly ip?: string;
  /** ISO timestamp of the change: the server's clock, or the demo's history; now when not given. */
  readonly at?: string;
  /** Whether to append to the audit log; only the demo seed, writing history, turns it off. */
  readonly audit?: boolean;
}
