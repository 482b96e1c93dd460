/** Batch input that cannot make a batch: missing, contradictory or impossible sizes. */
export class BatchError extends Error {
  override readonly name = 'BatchError';

  /**
   * @param message what is wrong, in plain words
   * @param option the command-line option (without dashes) or API field at fault, when known
   */
  constructor(
    message: string,
    readonly option?: string,
  ) {
    super(message);
  }
}
