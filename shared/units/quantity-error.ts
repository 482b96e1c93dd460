/** A quantity that could not be read: says what was given and what was expected. */
export class QuantityError extends Error {
  override readonly name = 'QuantityError';

  /**
   * @param input the text as the person typed it
   * @param expected what would have been accepted, with examples
   * @param reason what exactly is wrong with the input
   */
  constructor(
    readonly input: string,
    readonly expected: string,
    readonly reason: string,
  ) {
    super(`expected ${expected}, but got "${input}": ${reason}`);
  }
}
