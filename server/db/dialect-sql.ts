/**
 * The fragments of raw SQL that SQLite and PostgreSQL spell differently, in one place, so that a
 * query is written once with these in it. Each gives SQLite's text exactly as it was written
 * before PostgreSQL was added.
 */

import type { Sequelize } from 'sequelize';

/** Which database a statement is for. */
export type Dialect = 'sqlite' | 'postgres';

/** The database a Sequelize instance talks to, for code that holds the instance alone. */
export function dialectOf(sequelize: Sequelize): Dialect {
  return sequelize.getDialect() === 'postgres' ? 'postgres' : 'sqlite';
}

/** A JSON object of the given 'key', value pairs (SQL text), as a value inside other JSON. */
export function jsonObject(dialect: Dialect, pairs: string): string {
  return dialect === 'postgres' ? `json_build_object(${pairs})` : `json_object(${pairs})`;
}

/**
 * The JSON array of an aggregate's values as text ('[]' for no rows), `order` an ORDER BY clause
 * with its leading space or empty, `filter` a FILTER clause with its leading space or empty.
 */
export function jsonArrayText(dialect: Dialect, value: string, order = '', filter = ''): string {
  return dialect === 'postgres'
    ? `COALESCE(json_agg(${value}${order})${filter}::text, '[]')`
    : `json_group_array(${value}${order})${filter}`;
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

/**
 * SQLite's INDEXED BY, with its leading space, which holds a read to the index it was planned on;
 * PostgreSQL has no such clause (its planner chooses from the statistics), so nothing there.
 */
export function indexedBy(dialect: Dialect, index: string): string {
  return dialect === 'postgres' ? '' : ` INDEXED BY ${index}`;
}

/** LIKE in any case: SQLite's LIKE ignores ASCII case; PostgreSQL's needs ILIKE for that. */
export function likeAnyCase(dialect: Dialect): string {
  return dialect === 'postgres' ? 'ILIKE' : 'LIKE';
}

/**
 * The integer ids of a JSON array parameter (`[1,2]`) as a table of one column, `value`, to join
 * on: a list of any length is then one statement, prepared once.
 */
export function jsonIdTable(dialect: Dialect, parameter: string): string {
  return dialect === 'postgres'
    ? `(SELECT CAST(value AS integer) AS value FROM json_array_elements_text(CAST(${parameter} AS json)))`
    : `json_each(${parameter})`;
}

/**
 * A parameter whose type nothing around it says (a VALUES row, `? IS NULL`): PostgreSQL must be
 * told, SQLite takes the value as bound.
 */
export function typedParameter(
  dialect: Dialect,
  parameter: string,
  type: 'integer' | 'text',
): string {
  return dialect === 'postgres' ? `CAST(${parameter} AS ${type})` : parameter;
}

/**
 * The value at a path of keys (`['schedule', 'start']`) inside JSON stored as text: as text, or
 * as an integer (SQLite hands back a JSON number as a number; PostgreSQL's ->> gives text).
 */
export function jsonAt(
  dialect: Dialect,
  column: string,
  keys: readonly string[],
  type: 'text' | 'integer',
): string {
  if (dialect === 'sqlite') return `json_extract(${column}, '$.${keys.join('.')}')`;
  const text = `(${column}::json #>> '{${keys.join(',')}}')`;
  return type === 'integer' ? `${text}::integer` : text;
}

/**
 * Text that holds a number (a reading's value) as a floating-point number, to order by: SQLite's
 * REAL is 8 bytes, PostgreSQL's only 4, so there DOUBLE PRECISION.
 */
export function asReal(dialect: Dialect, value: string): string {
  return `CAST(${value} AS ${dialect === 'postgres' ? 'DOUBLE PRECISION' : 'REAL'})`;
}
