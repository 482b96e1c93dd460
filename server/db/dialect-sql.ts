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

/** A JSON object of the given 'key', value pairs (SQL text), as a text column of a row. */
export function jsonObjectText(dialect: Dialect, pairs: string): string {
  return dialect === 'postgres' ? `json_build_object(${pairs})::text` : `json_object(${pairs})`;
}

/**
 * The elements of the JSON array at a top-level key of a JSON text column, as a FROM item named
 * `alias` whose `value` column is each element (`key` a plain name).
 */
export function jsonEach(dialect: Dialect, column: string, key: string, alias: string): string {
  return dialect === 'postgres'
    ? `json_array_elements(${column}::json -> '${key}') ${alias}(value)`
    : `json_each(${column}, '$.${key}') ${alias}`;
}

/** A member of a JSON value (`key` a plain name), as a value put into other JSON as it is. */
export function jsonMember(dialect: Dialect, json: string, key: string): string {
  // SQLite's ->> gives the SQL value (a number stays a number); PostgreSQL's would give text, so
  // there the member stays JSON.
  return dialect === 'postgres' ? `${json} -> '${key}'` : `${json} ->> '${key}'`;
}

/** The number at a path of plain names inside a JSON text column; NULL when there is none. */
export function jsonNumberAt(dialect: Dialect, column: string, path: readonly string[]): string {
  return dialect === 'postgres'
    ? `(${column}::json #>> '{${path.join(',')}}')::float8`
    : `${column} ->> '$.${path.join('.')}'`;
}

/**
 * A column compared as SQLite compares it without its index: SQLite has no statistics, and `+`
 * keeps it from driving a query with a broad filter's index. PostgreSQL's planner has them, and
 * has no unary + on text.
 */
export function withoutIndex(dialect: Dialect, column: string): string {
  return dialect === 'postgres' ? column : `+${column}`;
}

/**
 * `left` equal to `right` ignoring case: SQLite's NOCASE folds ASCII letters, PostgreSQL's lower()
 * every letter.
 */
export function equalsIgnoringCase(dialect: Dialect, left: string, right: string): string {
  return dialect === 'postgres'
    ? `lower(${left}) = lower(${right})`
    : `${left} = ${right} COLLATE NOCASE`;
}

/**
 * A text value compared with a username column as a username: without case. SQLite's column
 * carries NOCASE into the comparison; PostgreSQL's citext column compares case-sensitively with
 * plain text unless the text is citext too.
 */
export function asUsername(dialect: Dialect, value: string): string {
  return dialect === 'postgres' ? `${value}::citext` : value;
}
