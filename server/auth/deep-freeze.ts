/**
 * Freezes a value and everything it holds, so that one object can be handed to many requests:
 * a handler that tried to change it would fail at once rather than change it for the next.
 */
export function deepFreeze<T>(value: T): T {
  if (value !== null && typeof value === 'object' && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const item of Object.values(value)) deepFreeze(item);
  }
  return value;
}
