/** A failure with the HTTP status and stable code the API answers with. */
export class AppError extends Error {
  override readonly name = 'AppError';

  /**
   * @param status HTTP status
   * @param code stable machine-readable code, e.g. "stale-revision"
   * @param message plain words for people
   * @param details extra facts: fields at fault, formula problems with line and column…
   */
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details: readonly unknown[] = [],
  ) {
    super(message);
  }
}

export const badRequest = (message: string, details: readonly unknown[] = []): AppError =>
  new AppError(400, 'bad-request', message, details);
export const notFound = (message: string): AppError => new AppError(404, 'not-found', message);
export const forbidden = (message = 'your role may not do this'): AppError =>
  new AppError(403, 'forbidden', message);
export const conflict = (
  code: string,
  message: string,
  details: readonly unknown[] = [],
): AppError => new AppError(409, code, message, details);
