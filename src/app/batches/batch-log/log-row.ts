import { UNSIGNABLE_STATUSES } from '../../../../shared/workflow/batch-status.ts';
import { isOverdue } from '../../curing/days-left';
import type { BatchListItem } from '../batch-types';
import { FORMULA_KIND_WORDS as KIND_WORDS } from '../formula-kind-words';

/** A batch as the log shows it, as a table row or a stacked card, with the marks it carries. */
export interface LogRow extends BatchListItem {
  /** Its kind in words. */
  readonly kindWords: string;
  /** Still held (curing, proofing) past its ready day. */
  readonly overdue: boolean;
  /** Not signed off yet, in a status a reviewer can sign off. */
  readonly awaitsSignOff: boolean;
}

/**
 * The log's rows for a page of batches.
 * @param today the kitchen's calendar day, YYYY-MM-DD: "overdue" is a ready day before it
 */
export function logRowsOf(items: readonly BatchListItem[], today: string): LogRow[] {
  return items.map((batch) => ({
    ...batch,
    kindWords: KIND_WORDS[batch.kind],
    overdue: isOverdue(batch, today),
    awaitsSignOff: !batch.signedOff && !UNSIGNABLE_STATUSES.includes(batch.status),
  }));
}
