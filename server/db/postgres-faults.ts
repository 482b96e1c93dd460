/**
 * PostgreSQL's failures that are about the database, not the request: the ones a write tries
 * again, and the ones answered with the same 503s as SQLite's busy and read-only files.
 */

/** pg's words for a connection lost under a query or used after it was lost. */
const LOST_CONNECTION = /^Connection terminated|is not queryable|Client was closed/;

/** PostgreSQL's SQLSTATE (or node's socket code) of a failed query, if there is one. */
export function postgresCode(error: unknown): string | undefined {
  const e = error as {
    parent?: { code?: unknown };
    original?: { code?: unknown };
    code?: unknown;
    name?: unknown;
  };
  const code = [e?.parent?.code, e?.original?.code, e?.code].find(
    (c): c is string => typeof c === 'string',
  );
  if (code) return code;
  // Sequelize names a connection it could not open without always keeping the socket's code.
  if (typeof e?.name === 'string' && e.name.startsWith('SequelizeConnection'))
    return 'ECONNREFUSED';
  // pg's own errors for a connection the server ended under a query (pg_terminate_backend, a
  // restart) carry no code at all: named here as SQLSTATE's connection failure.
  const messages = [e?.parent, e?.original, e].map((part) => (part as Error | undefined)?.message);
  if (messages.some((m) => typeof m === 'string' && LOST_CONNECTION.test(m))) return '08006';
  return undefined;
}

/**
 * Whether a write transaction lost a race and may simply run again: a serialization failure
 * (40001) or a deadlock (40P01). PostgreSQL rolled it back; nothing of it was kept.
 */
export function isWriteConflict(error: unknown): boolean {
  const code = postgresCode(error);
  if (code === '40001' || code === '40P01') return true;
  // A lot code another writer took between our read of the last one and our insert: PostgreSQL
  // reports most such races as 40001, but a unique violation may still come first.
  const e = error as { parent?: { constraint?: unknown }; original?: { constraint?: unknown } };
  const constraint = e?.parent?.constraint ?? e?.original?.constraint;
  return code === '23505' && typeof constraint === 'string' && constraint.endsWith('_lot_code_key');
}

/** What kind of 503 a PostgreSQL failure is, if it is one. */
export type PostgresFault = 'busy' | 'read-only' | 'unavailable';

// Socket codes of a server that is gone, restarting or unreachable.
const CONNECTION_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'EPIPE',
  'ETIMEDOUT',
  'ENOTFOUND',
  'EHOSTUNREACH',
]);

/**
 * The fault a PostgreSQL failure stands for: conflicts that outlasted their tries and a lock
 * timeout are "busy"; a read-only transaction (a standby, default_transaction_read_only) is
 * "read-only"; a lost or refused connection, a server shutting down or starting (57P01–57P03),
 * too many connections (53300) or a full disk (53100) is "unavailable".
 */
export function postgresFault(error: unknown): PostgresFault | undefined {
  const code = postgresCode(error);
  if (code === undefined) return undefined;
  if (code === '40001' || code === '40P01' || code === '55P03') return 'busy';
  if (code === '25006') return 'read-only';
  if (
    CONNECTION_CODES.has(code) ||
    code.startsWith('08') ||
    code.startsWith('57P') ||
    code === '53300' ||
    code === '53100'
  )
    return 'unavailable';
  return undefined;
}
