import { Router, type Request, type RequestHandler } from 'express';
import type { AppContext } from '../app-context.ts';
import { requireRole } from '../auth/authenticate.ts';
import { CLIENT_HEADER } from '../auth/basic-writes.ts';
import { changeBy, siteOf } from '../auth/request-person.ts';
import { notFound } from '../http/app-error.ts';
import { allowQuery } from '../http/require-json.ts';
import { validateBody } from '../http/validate-body.ts';
import { PROCESS_ROLES } from '../records/records.ts';
import type { ReadingRequest } from '../../shared/api/process-record.ts';
import type { Role } from '../../shared/api/person.ts';
import { DISPOSITIONS, type ActionRequest } from './corrective-actions.ts';
import { readLoggerFile } from './logger-body.ts';
import { readingSource } from './reading-input.ts';
import type { CorrectionRequest } from './reading-writes.ts';

/** Who verifies records and releases batches. */
const VERIFY_ROLES: readonly Role[] = ['admin', 'reviewer'];

const TEXT = { type: 'string', minLength: 1, maxLength: 2000 } as const;
const VALUE = { type: 'string', minLength: 1, maxLength: 100 } as const;
const TIME = { type: 'string', minLength: 1, maxLength: 40 } as const;

const READING_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['control', 'value'],
  properties: { control: { type: 'string', minLength: 1, maxLength: 64 }, value: VALUE, at: TIME },
} as const;

const CORRECTION_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['value', 'reason'],
  properties: { value: VALUE, at: TIME, reason: { type: 'string', minLength: 1, maxLength: 500 } },
} as const;

const ACTION_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['cause', 'restored', 'prevention', 'disposition'],
  properties: {
    cause: TEXT,
    restored: TEXT,
    prevention: TEXT,
    disposition: { enum: DISPOSITIONS },
    grams: VALUE,
    reason: { type: 'string', minLength: 1, maxLength: 500 },
  },
} as const;

const VERIFY_BODY = {
  type: 'object',
  additionalProperties: false,
  properties: { note: { type: 'string', minLength: 1, maxLength: 500 } },
} as const;

/** A body-less POST counts as an empty object. */
const emptyBody: RequestHandler = (req, _res, next) => {
  req.body ??= {};
  next();
};

/** A row id in a URL; anything else names nothing. */
function idOf(req: Request): number {
  const text = String(req.params.id);
  if (!/^[1-9]\d{0,15}$/.test(text)) throw notFound(`nothing has the id ${text}`);
  return Number(text);
}

const sourceOf = (req: Request) => readingSource(req.authVia, req.get(CLIENT_HEADER));

/**
 * The process record of a batch at /api/batches: GET /:lot/process; POST /:lot/readings,
 * /:lot/readings/upload and /:lot/verify. Everyone signed in reads and records readings;
 * admins and reviewers verify.
 */
export function batchProcessRouter(context: AppContext): Router {
  const { records } = context;
  const router = Router();
  const lotOf = (req: Request): string => String(req.params.lot);
  const now = (): string => context.now().toISOString();

  router.get('/:lot/process', async (req, res) => {
    // The record as written (its readings spliced in by SQLite): the bytes res.json sent, but
    // without its ETag, a hash of the whole megabyte of a day's logger points on every request.
    // A record is judged at the moment it is asked for: it is not kept.
    const parts = await records.processRecordJson(lotOf(req), now());
    res.type('json');
    res.setHeader('Cache-Control', 'no-store');
    res.setHeader(
      'Content-Length',
      parts.reduce((sum, part) => sum + part.length, 0),
    );
    for (const part of parts) res.write(part);
    res.end();
  });

  router.post(
    '/:lot/readings',
    requireRole(...PROCESS_ROLES),
    validateBody(READING_BODY),
    async (req, res) => {
      const answer = await records.addReading(
        lotOf(req),
        req.body as ReadingRequest,
        sourceOf(req),
        changeBy(req, context),
      );
      res.status(201).json(answer);
    },
  );

  router.post(
    '/:lot/readings/upload',
    requireRole(...PROCESS_ROLES),
    allowQuery('control'),
    readLoggerFile,
    async (req, res) => {
      const control = typeof req.query.control === 'string' ? req.query.control : '';
      const answer = await records.uploadReadings(
        lotOf(req),
        control,
        String(res.locals.loggerText),
        changeBy(req, context),
      );
      // Nothing new (the same file again) is no error, but nothing was created either.
      res.status(answer.added > 0 ? 201 : 200).json(answer);
    },
  );

  router.post(
    '/:lot/verify',
    requireRole(...VERIFY_ROLES),
    emptyBody,
    validateBody(VERIFY_BODY),
    async (req, res) => {
      const { note } = req.body as { note?: string };
      const verification = await records.verify(
        lotOf(req),
        note?.trim() || null,
        changeBy(req, context),
      );
      res.status(201).json({ verification });
    },
  );

  return router;
}

/** POST /api/readings/:id/correction. */
export function readingsRouter(context: AppContext): Router {
  const router = Router();
  router.post(
    '/:id/correction',
    requireRole(...PROCESS_ROLES),
    validateBody(CORRECTION_BODY),
    async (req, res) => {
      const answer = await context.records.correctReading(
        idOf(req),
        req.body as CorrectionRequest,
        sourceOf(req),
        changeBy(req, context),
      );
      res.status(201).json(answer);
    },
  );
  return router;
}

/** POST /api/deviations/:id/action. */
export function deviationsRouter(context: AppContext): Router {
  const router = Router();
  router.post(
    '/:id/action',
    requireRole(...PROCESS_ROLES),
    validateBody(ACTION_BODY),
    async (req, res) => {
      const deviation = await context.records.recordAction(
        idOf(req),
        req.body as ActionRequest,
        changeBy(req, context),
      );
      res.status(201).json({ deviation });
    },
  );
  return router;
}

/** GET /api/process/now: what needs attention across the batches being made. */
export function processNowRouter(context: AppContext): Router {
  const router = Router();
  router.get('/now', async (req, res) => {
    res.json(await context.records.processNow(context.now().toISOString(), siteOf(req)));
  });
  return router;
}
