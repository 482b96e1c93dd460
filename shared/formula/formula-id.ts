/**
 * What a formula id looks like: lower-case letters, digits and dashes, 2 to 63 characters. The
 * schema's `$defs.id` holds the same pattern (a spec keeps the two equal). Ids are the only thing
 * a formula file's path is ever built from, so every id from outside is checked against this first.
 */
export const FORMULA_ID_PATTERN = '^[a-z0-9][a-z0-9-]{1,62}$';

/** {@link FORMULA_ID_PATTERN} as a regular expression. */
export const FORMULA_ID = new RegExp(FORMULA_ID_PATTERN);

/** Whether a value is a well-formed formula id. */
export function isFormulaId(value: unknown): value is string {
  return typeof value === 'string' && FORMULA_ID.test(value);
}
