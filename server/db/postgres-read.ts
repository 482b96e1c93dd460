import type { Sequelize } from 'sequelize';

interface PgClient {
  query(config: { text: string; values: unknown[]; name?: string }): Promise<{ rows: unknown[] }>;
}

interface PgConnectionManager {
  getConnection(options: object): Promise<PgClient>;
  releaseConnection(connection: PgClient): Promise<void>;
}

// Statements in PostgreSQL's numbered form, by their SQLite text: worked out once each.
const numbered = new Map<string, string>();

/**
 * SQLite's parameter marks (? in order, or ?1, ?2… by number) as PostgreSQL's $1, $2…; a mark
 * inside a quoted string or name is text, left as it is.
 */
export function numberedParameters(sql: string): string {
  let out = numbered.get(sql);
  if (out !== undefined) return out;
  out = '';
  let next = 0;
  let quote: string | null = null;
  for (let i = 0; i < sql.length; i++) {
    const c = sql[i];
    if (quote) {
      if (c === quote) quote = null;
      out += c;
    } else if (c === "'" || c === '"') {
      quote = c;
      out += c;
    } else if (c === '?') {
      const digits = /^\d+/.exec(sql.slice(i + 1))?.[0];
      if (digits) {
        out += `$${digits}`;
        i += digits.length;
      } else out += `$${++next}`;
    } else out += c;
  }
  numbered.set(sql, out);
  return out;
}

/**
 * Reads rows straight from a pooled pg connection, the PostgreSQL side of read-row.ts: the SQL
 * as the SQLite path takes it, its marks numbered, the values bound. Reads only.
 */
export async function postgresRows<T>(
  sequelize: Sequelize,
  sql: string,
  values: readonly (string | number)[],
): Promise<T[]> {
  const manager = sequelize.connectionManager as unknown as PgConnectionManager;
  const connection = await manager.getConnection({ type: 'SELECT' });
  try {
    const result = await connection.query({ text: numberedParameters(sql), values: [...values] });
    return result.rows as T[];
  } finally {
    await manager.releaseConnection(connection);
  }
}
