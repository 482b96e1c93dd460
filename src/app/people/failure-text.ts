import { ApiError } from '../core/api/api-error';

/**
 * The server's message for a failed request, written as a sentence ("the username … is taken" →
 * "The username … is taken.").
 * @param error What the request failed with.
 * @param fallback What to say when the failure is not an API error.
 */
export function failureText(error: unknown, fallback: string): string {
  if (!(error instanceof ApiError)) return fallback;
  const text = error.message.trim();
  if (text === '') return fallback;
  const sentence = text[0].toUpperCase() + text.slice(1);
  return /[.!?…]$/.test(sentence) ? sentence : `${sentence}.`;
}
