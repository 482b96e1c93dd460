import type { PresentedResult } from '../../shared/presentation/presented-result.ts';
import { RecordsError } from '../records/records-error.ts';

/** Each size a hold is reckoned on, as the batch option is spelled in errors and in words. */
const SIZES = {
  thickness: { option: 'thickness', words: 'the thickness of the thickest piece' },
  largestPiece: { option: 'largest-piece', words: 'the weight of the heaviest piece' },
} as const;

/**
 * Refuses to record a cure made without the size its hold is reckoned on: without it there is no
 * ready date, and a cure taken out early is not safe to eat. A planned batch may wait for the
 * size until it is started. The error names the size in words and, in its details, the option.
 * @throws RecordsError 'bad-input' with code 'hold-size-needed'
 */
export function requireHoldSize(result: PresentedResult): void {
  if (!result.holdNeeds) return;
  const size = SIZES[result.holdNeeds];
  throw new RecordsError(
    'bad-input',
    'hold-size-needed',
    `this cure's hold goes by ${size.words}: give it, so the batch has a ready date`,
    [{ option: size.option, field: result.holdNeeds }],
  );
}
