import type { ErrorRequestHandler, RequestHandler } from 'express';
import { BatchError } from '../../shared/index.ts';
import { AppError } from './app-error.ts';

/** JSON 404 for any /api route nobody answered. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError(404, 'not-found', `no such API route: ${req.method} ${req.path}`));
};

interface BodyParserError {
  type?: string;
  status?: number;
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
  if (error instanceof AppError) {
    appError = error;
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
  res
    .status(appError.status)
    .json({ error: { code: appError.code, message: appError.message, details: appError.details } });
};
