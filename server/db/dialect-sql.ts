/**
 * The fragments of raw SQL that SQLite and PostgreSQL spell differently, in one place, so that a
 * query is written once with these in it. Each gives SQLite's text exactly as it was written
 * before PostgreSQL was added.
 */

/** Which database a statement is for. */
export type Dialect = 'sqlite' | 'postgres';

/** A JSON object of the given 'key', value pairs (SQL text), as a value inside other JSON. */
export function jsonObject(dialect: Dialect, pairs: string): string {
  return dialect === 'postgres' ? `json_build_object(${pairs})` : `json_object(${pairs})`;
}

/**
 * The JSON array of an aggregate's values as text ('[]' for no rows), `order` an ORDER BY clause
 * with its leading space or empty.
 */
export function jsonArrayText(dialect: Dialect, value: string, order = ''): string {
  return dialect === 'postgres'
    ? `COALESCE(json_agg(${value}${order})::text, '[]')`
    : `json_group_array(${value}${order})`;
}

/**
 * The integer at a top-level key of a JSON object stored as text (`key` a plain name), for joins
 * on an id kept inside JSON (a session's person).
 */
export function jsonInteger(dialect: Dialect, column: string, key: string): string {
  return dialect === 'postgres'
    ? `(${column}::json ->> '${key}')::integer`
    : `json_extract(${column}, '$.${key}')`;
}
