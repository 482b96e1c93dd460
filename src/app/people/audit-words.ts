/** Small helpers the audit log's words share: reading an entry's detail safely. */

/** The detail as an object of fields; an empty one when it is not an object. */
export function fieldsOf(detail: unknown): Record<string, unknown> {
  return detail !== null && typeof detail === 'object' && !Array.isArray(detail)
    ? (detail as Record<string, unknown>)
    : {};
}

/** Whether a field holds something to show. */
export function present(value: unknown): boolean {
  return value !== undefined && value !== null && value !== '';
}

/** A field's value as text. */
export function wordsOf(value: unknown): string {
  if (typeof value === 'string') return value;
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  if (value === null || value === undefined) return '';
  return JSON.stringify(value);
}

/** Whom a message went to: "to tobin, rosa", "to nobody"; empty when the detail does not say. */
export function recipientsText(to: unknown): string {
  if (!Array.isArray(to)) return '';
  return to.length === 0 ? 'to nobody' : `to ${to.map(wordsOf).join(', ')}`;
}

/** The parts that are not empty, joined. */
export function join(parts: readonly string[], separator: string): string {
  return parts.filter((part) => part !== '').join(separator);
}
