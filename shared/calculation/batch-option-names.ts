/**
 * The names of the batch options: the keys of a calculation's `batch` in the API, and of
 * `larder calc`'s flags once commander has camel-cased them (--largest-piece → largestPiece).
 * The server's request schema, the command's flags and the console's record form take them from here.
 */
import type { BatchInput } from './batch-input.ts';

/** Every batch option, in the order the API's request schema lists them. */
export const BATCH_OPTION_NAMES = [
  'start',
  'want',
  'meat',
  'thickness',
  'largestPiece',
  'water',
  'pump',
  'pumpedWeight',
  'pieces',
  'piece',
  'loss',
  'flour',
  'ddt',
  'room',
  'flourTemp',
  'prefermentTemp',
  'tap',
  'friction',
  'yeast',
  'total',
  'targetFat',
  'onHand',
  'fatTest',
  'portion',
  'base',
  'count',
] as const satisfies readonly (keyof BatchInput)[];

/** One of {@link BATCH_OPTION_NAMES}. */
export type BatchOptionName = (typeof BATCH_OPTION_NAMES)[number];

// Fails to compile when BatchInput gains a field this list does not name.
const everyInputNamed: Exclude<keyof BatchInput, BatchOptionName> extends never ? true : never =
  true;
void everyInputNamed;
