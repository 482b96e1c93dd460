import type { BatchStatus, FormulaKind } from './batch-types';

/** Every status, in the order of the work. */
export const BATCH_STATUSES: readonly BatchStatus[] = [
  'planned',
  'in-progress',
  'curing',
  'proofing',
  'done',
  'discarded',
];

/** One move a cook can make from where a batch is now. */
export interface StatusMove {
  readonly to: BatchStatus;
  /** The button's words. */
  readonly action: string;
  /** Whether the move needs a reason (discarding does). */
  readonly needsReason: boolean;
}

// Mirrors TRANSITIONS in server/batches/batch.ts; the server refuses anything else with 409.
const MOVES: Readonly<Record<BatchStatus, readonly BatchStatus[]>> = {
  planned: ['in-progress', 'discarded'],
  'in-progress': ['curing', 'proofing', 'done', 'discarded'],
  curing: ['done', 'discarded'],
  proofing: ['done', 'discarded'],
  done: [],
  discarded: [],
};

const ACTIONS: Readonly<Record<BatchStatus, string>> = {
  planned: 'Back to planned',
  'in-progress': 'Start the batch',
  curing: 'Start curing',
  proofing: 'Start proofing',
  done: 'Mark done',
  discarded: 'Discard…',
};

/**
 * The moves a batch of this kind may make from its status: curing is for cures only, proofing
 * for doughs only; done and discarded are final.
 */
export function allowedMoves(from: BatchStatus, kind: FormulaKind): StatusMove[] {
  return MOVES[from]
    .filter((to) =>
      to === 'curing' ? kind === 'cure' : to === 'proofing' ? kind === 'dough' : true,
    )
    .map((to) => ({ to, action: ACTIONS[to], needsReason: to === 'discarded' }));
}
