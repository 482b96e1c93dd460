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

/**
 * The refusal for calculating an assembly as if it were one batch: an assembly is a menu item
 * built from other formulas, and is planned instead (`larder plan`, POST /api/plans).
 */
export function assemblyIsPlanned(id: string): BatchError {
  return new BatchError(
    `${id} is an assembly (a menu item built from other formulas), not one batch: plan it with ` +
      `\`larder plan ${id} --count N --for YYYY-MM-DD\`, which works out every batch it needs`,
  );
}
