import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { ApiErrorBody } from '../../shared/api/api-error.ts';
import { BatchError } from '../../shared/index.ts';
import { RecordsError } from '../records/records-error.ts';
import { postgresCode, postgresFault } from '../db/postgres-faults.ts';
import { AppError } from './app-error.ts';
import { appErrorOf } from './failure-status.ts';
import { RetryLaterError } from './retry-later.ts';

/** JSON 404 for any /api route nobody answered. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError(404, 'not-found', `no such API route: ${req.method} ${req.path}`));
};

interface BodyParserError {
  type?: string;
  status?: number;
}

/** SQLite's result code of a failed query ("SQLITE_BUSY", "SQLITE_READONLY"…), if it is one. */
export function sqliteCode(error: unknown): string | undefined {
  const e = error as { parent?: { code?: unknown }; original?: { code?: unknown }; code?: unknown };
  const code = [e?.parent?.code, e?.original?.code, e?.code].find(
    (c): c is string => typeof c === 'string' && c.startsWith('SQLITE_'),
  );
  return code;
}

/**
 * A database that cannot take a write just now, as a 503 saying why; undefined for any other
 * error. SQLite wrote nothing: a failed statement ends its transaction with a rollback.
 */
function storageError(error: unknown): AppError | undefined {
  const code = sqliteCode(error);
  if (code === undefined) return postgresStorageError(error);
  if (code.startsWith('SQLITE_BUSY') || code.startsWith('SQLITE_LOCKED')) return busy();
  if (code.startsWith('SQLITE_READONLY'))
    return new AppError(
      503,
      'database-read-only',
      'the database file cannot be written (it is read-only); nothing was saved',
    );
  if (
    ['SQLITE_FULL', 'SQLITE_IOERR', 'SQLITE_CANTOPEN', 'SQLITE_PERM'].some((c) =>
      code.startsWith(c),
    )
  )
    return new AppError(
      503,
      'database-unavailable',
      `the database cannot be written just now (${code}); nothing was saved`,
    );
  return undefined;
}

const busy = () =>
  new AppError(
    503,
    'database-busy',
    'the database is locked by another program; nothing was saved, try again in a moment',
  );

/**
 * PostgreSQL's equivalents of SQLite's busy and read-only files, as the same 503s: conflicts that
 * outlasted their tries are busy; a lost connection or a server restarting is unavailable.
 * PostgreSQL rolled the transaction back: nothing was saved.
 */
function postgresStorageError(error: unknown): AppError | undefined {
  const fault = postgresFault(error);
  if (fault === 'busy') return busy();
  if (fault === 'read-only')
    return new AppError(
      503,
      'database-read-only',
      'the database server takes no writes just now (it is read-only); nothing was saved',
    );
  if (fault === 'unavailable')
    return new AppError(
      503,
      'database-unavailable',
      `the database server cannot be reached just now (${postgresCode(error)}); nothing was saved`,
    );
  return undefined;
}

/**
 * The one place errors become responses: `{ error: { code, message, details } }`. Unknown errors
 * are logged and answered 500 without internals.
 */
export const errorHandler: ErrorRequestHandler = (error: unknown, _req, res, next) => {
  if (res.headersSent) {
    next(error);
    return;
  }
  let appError: AppError;
  const parserError = error as BodyParserError;
  const storage = storageError(error);
  if (error instanceof AppError) {
    appError = error;
    if (error instanceof RetryLaterError)
      res.setHeader('Retry-After', String(error.retryAfterSeconds));
  } else if (error instanceof RecordsError) {
    appError = appErrorOf(error);
  } else if (storage) {
    // For whoever looks after the server; the message is SQLite's, without the SQL.
    console.error(`database: ${(error as Error).message}`); // eslint-disable-line no-console -- the server log is the place for it
    appError = storage;
    if (storage.code === 'database-busy') res.setHeader('Retry-After', '5');
  } else if (error instanceof BatchError) {
    appError = new AppError(
      400,
      'bad-batch',
      error.message,
      error.option ? [{ option: error.option }] : [],
    );
  } else if (parserError.type === 'entity.parse.failed') {
    appError = new AppError(400, 'bad-json', 'the request body is not valid JSON');
  } else if (parserError.type === 'entity.too.large') {
    appError = new AppError(413, 'too-large', 'the request body is too large');
  } else if (
    parserError.type === 'encoding.unsupported' ||
    parserError.type === 'charset.unsupported'
  ) {
    appError = new AppError(415, 'unsupported-encoding', 'send the body as UTF-8 JSON');
  } else if (
    typeof parserError.status === 'number' &&
    parserError.status >= 400 &&
    parserError.status < 500
  ) {
    appError = new AppError(parserError.status, 'bad-request', (error as Error).message);
  } else {
    // Only the stack: a database error's own fields carry the SQL with its values (a password hash).
    console.error(error instanceof Error ? (error.stack ?? error.message) : error); // eslint-disable-line no-console -- the server log is the place for a bug
    appError = new AppError(
      500,
      'internal',
      'something went wrong on the server; it has been logged',
    );
  }
  res.status(appError.status).json({
    error: { code: appError.code, message: appError.message, details: appError.details },
  } satisfies ApiErrorBody);
};
