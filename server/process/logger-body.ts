import express, { type RequestHandler } from 'express';
import multer from 'multer';
import { AppError, badRequest } from '../http/app-error.ts';
import { MAX_LOG_BYTES, TOO_LARGE_WORDS, overLogLimits } from './logger-upload.ts';

const TOO_LARGE = (): AppError => new AppError(413, 'too-large', TOO_LARGE_WORDS);

/**
 * A logger's CSV sent as the raw body (Content-Type text/csv), read as text before the API's
 * JSON parser, on the upload route only. A form cannot send text/csv across sites, and a
 * password-signed script still names itself (server/auth/basic-writes.ts).
 */
export const loggerText: RequestHandler = (req, res, next) => {
  express.text({ type: 'text/csv', limit: MAX_LOG_BYTES })(req, res, (error?: unknown) => {
    const parser = error as { type?: string } | undefined;
    next(parser?.type === 'entity.too.large' ? TOO_LARGE() : error);
  });
};

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_LOG_BYTES, files: 1, fields: 0, parts: 1 },
});

/**
 * The logger file of an upload: the raw text/csv body, or the multipart field `file`, as UTF-8
 * text in `res.locals.loggerText`.
 * @throws AppError 413 too-large (2 MB, 20,000 lines), 415 not-csv, 400 for a broken form or a file that is not UTF-8
 */
export const readLoggerFile: RequestHandler = (req, res, next) => {
  if (typeof req.body === 'string') {
    if (overLogLimits(req.body)) return next(TOO_LARGE());
    res.locals.loggerText = req.body;
    return next();
  }
  if (!req.is('multipart/form-data'))
    return next(
      new AppError(
        415,
        'not-csv',
        'send the logger file as text/csv, or as the field "file" of multipart/form-data',
      ),
    );
  upload.single('file')(req, res, (error?: unknown) => {
    if (error instanceof multer.MulterError)
      return next(
        error.code === 'LIMIT_FILE_SIZE'
          ? TOO_LARGE()
          : badRequest(`send one file in the field "file": ${error.message}`, [
              { field: error.field ?? 'file' },
            ]),
      );
    if (error)
      return next(
        badRequest(`the upload is not valid multipart/form-data: ${(error as Error).message}`),
      );
    if (!req.file)
      return next(badRequest('send the logger file in the field "file"', [{ field: 'file' }]));
    try {
      res.locals.loggerText = new TextDecoder('utf-8', { fatal: true }).decode(req.file.buffer);
      if (overLogLimits(String(res.locals.loggerText))) return next(TOO_LARGE());
    } catch {
      return next(
        badRequest('the logger file is not UTF-8 text; export it as CSV', [{ field: 'file' }]),
      );
    }
    next();
  });
};
