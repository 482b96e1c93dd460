/**
 * The hold and release rules of a batch's process record (HACCP): a batch with an open
 * deviation is on hold, and a batch is released only by a verification of its records. Data
 * and pure functions, so the server enforces them and the console explains them from one place.
 */
import type { BatchStatus } from '../api/batch-record.ts';
import { signOffRefusal, type WorkflowRules } from './workflow-rules.ts';

/** Why a hold or release rule refuses: the API's status and stable code, and a cook's words. */
export interface ReleaseRefusal {
  readonly status: 403 | 409;
  readonly code: 'on-hold' | 'not-finished' | 'controls-open' | 'own-batch';
  readonly message: string;
}

/** What the release rules look at of a batch. */
export interface ReleaseBatch {
  readonly status: BatchStatus;
  /** Who recorded it. */
  readonly operatorId: number;
  /** Deviations without a corrective action. */
  readonly openDeviations: number;
  /**
   * The controls neither met nor closed: in progress, waiting, or missed without every miss's
   * deviation closed. Their titles, in the formula's order.
   */
  readonly openControls: readonly string[];
}

const ON_HOLD: ReleaseRefusal = {
  status: 409,
  code: 'on-hold',
  message:
    'this batch is on hold: a critical limit was missed and its deviation has no corrective action yet; record the corrective action first',
};

/**
 * Why a batch may not be marked done; undefined when it may. A move to done while a deviation is
 * open would let product with a missed critical limit go on as finished.
 */
export function doneRefusal(openDeviations: number): ReleaseRefusal | undefined {
  return openDeviations > 0 ? ON_HOLD : undefined;
}

/**
 * Why this person may not verify (release) this batch; undefined when they may. The pre-shipment
 * review of 9 CFR 417.5(c): the batch is finished, nothing is on hold, every control is met or
 * its misses have corrective actions, and (under the separate sign-off rule) the reviewer is not
 * the person who recorded it.
 */
export function verifyRefusal(
  batch: ReleaseBatch,
  verifier: { readonly id: number },
  rules: WorkflowRules,
): ReleaseRefusal | undefined {
  if (batch.status !== 'done')
    return {
      status: 409,
      code: 'not-finished',
      message: 'only a batch marked done can be verified and released; finish the batch first',
    };
  if (batch.openDeviations > 0) return ON_HOLD;
  if (batch.openControls.length > 0)
    return {
      status: 409,
      code: 'controls-open',
      message: `not every critical limit is met: ${batch.openControls.join(', ')}; record the missing readings, or the corrective action of each miss`,
    };
  if (signOffRefusal({ operatorId: batch.operatorId }, verifier, rules))
    return {
      status: 403,
      code: 'own-batch',
      message: 'you recorded this batch; another person verifies and releases it',
    };
  return undefined;
}
