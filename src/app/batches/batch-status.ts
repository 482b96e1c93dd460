import {
  moveRefusal,
  signOffRefusal,
  type WorkflowPerson,
  type WorkflowRefusal,
  type WorkflowRules,
} from '../../../shared/workflow/workflow-rules.ts';
import { movesFrom } from '../../../shared/workflow/batch-status.ts';
import type { Batch, BatchStatus } from './batch-types';

/** One move a cook can make from where a batch is now. */
export interface StatusMove {
  readonly to: BatchStatus;
  /** The button's words. */
  readonly action: string;
  /** Whether the move needs a reason (discarding does). */
  readonly needsReason: boolean;
}

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
export function allowedMoves(from: BatchStatus, kind: Batch['kind']): StatusMove[] {
  return movesFrom(from, kind).map((to) => ({
    to,
    action: ACTIONS[to],
    needsReason: to === 'discarded',
  }));
}

/** A move as the batch page offers it to the signed-in person. */
export interface OfferedMove extends StatusMove {
  /** Why this person cannot make the move now, in a cook's words; null when they can. */
  readonly blocked: string | null;
}

/** A rule's words as a sentence on screen. */
function sentence(refusal: WorkflowRefusal | undefined): string | null {
  if (!refusal) return null;
  return `${refusal.message[0].toUpperCase()}${refusal.message.slice(1)}.`;
}

/**
 * The moves of a batch as the server's workflow rules leave them to this person: each allowed
 * move, with why it is held back (a signed-off batch for a cook, a cure not yet cured); an admin
 * moving a signed-off batch is asked a reason, as for discarding.
 */
export function offeredMoves(
  batch: Pick<Batch, 'kind' | 'status' | 'signedOff'>,
  person: Pick<WorkflowPerson, 'role'>,
  rules: WorkflowRules,
): OfferedMove[] {
  const facts = { kind: batch.kind, status: batch.status, signedOff: batch.signedOff !== null };
  return allowedMoves(batch.status, batch.kind).map((move) => {
    const asked = (reason: string | null) =>
      moveRefusal(facts, move.to, { role: person.role, reason }, rules);
    const bare = asked(null);
    if (bare?.code !== 'reason-needed') return { ...move, blocked: sentence(bare) };
    // The dialog asks the reason; whatever else the rules say still holds the move back.
    return { ...move, needsReason: true, blocked: sentence(asked('asked in the dialog')) };
  });
}

/** Why this person may not sign the batch off under the rules, as a sentence; null when they may. */
export function signOffBlocked(
  batch: Pick<Batch, 'operator'>,
  person: Pick<WorkflowPerson, 'id'>,
  rules: WorkflowRules,
): string | null {
  return sentence(signOffRefusal({ operatorId: batch.operator.id }, person, rules));
}
