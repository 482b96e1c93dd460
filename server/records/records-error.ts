import { AppError } from '../http/app-error.ts';
import { failureOfStatus } from '../http/failure-status.ts';
import { RetryLaterError } from '../http/retry-later.ts';

/**
 * What went wrong, in record keeping's own terms: the input cannot make a record, the person may
 * not do this, there is no such thing, it clashes with what is recorded, or the rules refuse it
 * (a batch over a critical limit). The API says each as an HTTP status, the command as an exit code.
 */
export type RecordsFailure = 'bad-input' | 'forbidden' | 'not-found' | 'conflict' | 'refused';

/** A failure of record keeping, with a stable code ("critical-limit", "username-taken") and words. */
export class RecordsError extends Error {
  override readonly name = 'RecordsError';

  constructor(
    readonly kind: RecordsFailure,
    readonly code: string,
    message: string,
    readonly details: readonly unknown[] = [],
  ) {
    super(message);
  }
}

/**
 * The failures of the parts record keeping shares with the rest of the API (the formula store,
 * the batch calculation, the workflow rules), which speak HTTP, in record keeping's terms; any
 * other error as it is. A wait to retry after keeps its own error, for its Retry-After header.
 */
export function recordsErrorOf(error: unknown): unknown {
  if (!(error instanceof AppError) || error instanceof RetryLaterError) return error;
  const kind = failureOfStatus(error.status);
  return kind ? new RecordsError(kind, error.code, error.message, error.details) : error;
}
