import { optionsInWords } from '../../../../shared/presentation/option-words.ts';
import { ApiError } from './api-error';

/** What the console says of a failure that is not the API's: a fault in the console itself. */
export const SOMETHING_WENT_WRONG = 'Something went wrong; try again.';

/**
 * How the API's message is shown: as the server wrote it ("the username … is taken"), to stand
 * in a line of the screen or after a lead-in, or as a sentence of its own ("The username … is
 * taken.").
 */
export type MessageForm = 'as-sent' | 'sentence';

/**
 * A failed request in words for the screen: the API's own message, with any command-line option
 * of the core's words in a field's words, or `fallback` when the failure is not the API's or its
 * message is blank.
 * @param error What the request failed with.
 * @param fallback What to say instead; a sentence.
 * @param form Whether the API's message is shown as sent or as a sentence.
 */
export function messageOf(
  error: unknown,
  fallback = SOMETHING_WENT_WRONG,
  form: MessageForm = 'as-sent',
): string {
  if (!(error instanceof ApiError)) return fallback;
  const text = optionsInWords(error.message.trim());
  if (text === '') return fallback;
  if (form === 'as-sent') return text;
  const sentence = text[0].toUpperCase() + text.slice(1);
  return /[.!?…]$/.test(sentence) ? sentence : `${sentence}.`;
}
