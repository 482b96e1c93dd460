import { AppError } from './app-error.ts';

/**
 * A refusal that passes: too many attempts, or too much work just now. The error handler sends
 * its wait in a Retry-After header.
 */
export class RetryLaterError extends AppError {
  /**
   * @param status 429 (this caller asked too often) or 503 (the server is busy)
   * @param retryAfterSeconds whole seconds until asking again may succeed
   */
  constructor(
    status: 429 | 503,
    code: string,
    message: string,
    readonly retryAfterSeconds: number,
  ) {
    super(status, code, message);
  }
}
