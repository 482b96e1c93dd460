/**
 * The batch status machine: which statuses there are, the moves between them and what each is
 * called. Data and pure functions, so the server enforces the moves and the console offers them
 * from one definition.
 */
import type { BatchStatus } from '../api/batch-record.ts';
import type { BatchKind, FormulaKind } from '../formula/formula-types.ts';

/** Every status, in the order of the work. */
export const BATCH_STATUSES: readonly BatchStatus[] = [
  'planned',
  'in-progress',
  'curing',
  'proofing',
  'done',
  'discarded',
];

/**
 * The statuses a batch may be recorded with: planned, or in progress; an assembly also done,
 * made on its day (see recordedStatus).
 */
export const RECORD_STATUSES = ['planned', 'in-progress', 'done'] as const;

/** One of {@link RECORD_STATUSES}. */
export type RecordStatus = (typeof RECORD_STATUSES)[number];

/**
 * The status a new batch is recorded with, or why it cannot be (in a cook's words). A batch of a
 * cure, dough, blend or mix is recorded planned or in progress (the default), then moved along
 * as it is made. An assembly (burgers, packs) is put together in one go on its day, with no hold
 * and no process controls to read (a formula may give an assembly none), so it is recorded done
 * unless it is for a later day, when it is planned; a cook may still say planned or in progress.
 * @param startedOn the batch's day (ISO date); today the recorder's
 */
export function recordedStatus(
  kind: FormulaKind,
  asked: RecordStatus | undefined,
  startedOn: string,
  today: string,
): { status: RecordStatus } | { refusal: string } {
  if (kind !== 'assembly') {
    if (asked === 'done')
      return {
        refusal:
          'only an assembly is recorded as done: record this batch planned or in progress, then move it along as it is made',
      };
    return { status: asked ?? 'in-progress' };
  }
  const later = startedOn > today;
  if (asked === 'done' && later)
    return { refusal: 'an assembly for a later day is not made yet: record it as planned' };
  return { status: asked ?? (later ? 'planned' : 'done') };
}

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
export const HOLD_KIND: Readonly<Partial<Record<BatchStatus, BatchKind>>> = {
  curing: 'cure',
  proofing: 'dough',
};

/** The statuses in which a batch cannot be signed off: nothing has been made, or it was thrown away. */
export const UNSIGNABLE_STATUSES: readonly BatchStatus[] = ['planned', 'discarded'];

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

/** The moves a batch of this kind may make from its status, in the order of the work. */
export function movesFrom(from: BatchStatus, kind: FormulaKind): BatchStatus[] {
  return TRANSITIONS[from].filter((to) => refusedMove(from, to, kind) === undefined);
}

const STATUS_WORDS: Readonly<Record<BatchStatus, string>> = {
  planned: 'Planned',
  'in-progress': 'In progress',
  curing: 'Curing',
  proofing: 'Proofing',
  done: 'Done',
  discarded: 'Discarded',
};

/** A batch status in words, as people read it: "in-progress" → "In progress". */
export function statusInWords(status: BatchStatus): string {
  return STATUS_WORDS[status];
}
