import { Router, type Request, type RequestHandler, type Response } from 'express';
import type { AppContext } from '../app-context.ts';
import { requireRole } from '../auth/authenticate.ts';
import { changeBy, siteOf } from '../auth/request-person.ts';
import { BATCH_OPTIONS_SCHEMA, UNITS_SCHEMA } from '../calc/calc-request.ts';
import { validateBody } from '../http/validate-body.ts';
import { RECORDING_ROLES, batchSheetPdf, type RecordRequest } from '../records/records.ts';
import { serverToday } from '../server-today.ts';
import type { BatchStatus } from '../../shared/api/batch-record.ts';
import { FORMULA_ID_PATTERN } from '../../shared/formula/formula-id.ts';
import { BATCH_STATUSES, RECORD_STATUSES } from '../../shared/workflow/batch-status.ts';
import { CSV_HEADER, batchCsvLine } from './batch-csv.ts';
import { parseListQuery } from './batch-query.ts';
import { atSite } from './read-batches.ts';
import { labelContentRoute, labelRoute } from './label-route.ts';
import { sendPdf } from '../http/send-pdf.ts';

const RECORD_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['formula', 'batch'],
  properties: {
    formula: { type: 'string', pattern: FORMULA_ID_PATTERN },
    batch: BATCH_OPTIONS_SCHEMA,
    units: UNITS_SCHEMA,
    status: { enum: RECORD_STATUSES },
    notes: { type: 'string', maxLength: 2000 },
  },
} as const;

const STATUS_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['to'],
  properties: {
    to: { enum: BATCH_STATUSES },
    reason: { type: 'string', minLength: 1, maxLength: 500 },
  },
} as const;

const SIGN_OFF_BODY = {
  type: 'object',
  additionalProperties: false,
  properties: { note: { type: 'string', minLength: 1, maxLength: 500 } },
} as const;

const TURN_BODY = {
  type: 'object',
  additionalProperties: false,
  properties: { note: { type: 'string', maxLength: 500 } },
} as const;

/** A body-less POST counts as an empty object, so `{}` need not be sent. */
const emptyBody: RequestHandler = (req, _res, next) => {
  req.body ??= {};
  next();
};

/**
 * /api/batches: the batch log. Every signed-in role reads; admins and cooks record batches and
 * move them along; admins and reviewers sign them off.
 */
export function batchesRouter(context: AppContext): Router {
  const { records, config } = context;
  const router = Router();
  const lotOf = (req: Request): string => String(req.params.lot);

  router.get('/', async (req, res) => {
    res.json(await records.listBatches(req.query, siteOf(req)));
  });

  router.post('/', requireRole(...RECORDING_ROLES), validateBody(RECORD_BODY), async (req, res) => {
    const batch = await records.recordBatch(
      req.body as RecordRequest,
      serverToday(context),
      changeBy(req, context),
    );
    res.status(201).location(`/api/batches/${batch.lotCode}`).json({ batch });
  });

  router.get('/:lot', async (req, res) => {
    const batch = await records.showBatch(lotOf(req), siteOf(req));
    // The rules in force, so the console can say why an action is not offered.
    res.json({ batch, rules: config.workflow });
  });

  // The batch sheet as a PDF to print or file; pdfkit loads on the first request, not at start.
  router.get('/:lot/sheet.pdf', async (req, res) => {
    const batch = await records.showBatch(lotOf(req), siteOf(req));
    const pdf = await batchSheetPdf(batch.result, batch);
    sendPdf(res, pdf, `${batch.lotCode}.pdf`);
  });

  // A product label for the batch's packages (4 × 6 in), or its 2 × 1 in lot and date sticker
  // alone or on a letter or A4 sheet, and its content for the console's preview, for any role.
  router.get('/:lot/label.pdf', labelRoute(context));
  router.get('/:lot/label', labelContentRoute(context));

  router.post(
    '/:lot/status',
    requireRole(...RECORDING_ROLES),
    validateBody(STATUS_BODY),
    async (req, res) => {
      const { to, reason } = req.body as { to: BatchStatus; reason?: string };
      const batch = await records.changeStatus(
        lotOf(req),
        to,
        reason?.trim() || null,
        changeBy(req, context),
      );
      res.json({ batch });
    },
  );

  // A turn of a curing batch, today, by whoever is signed in.
  router.post(
    '/:lot/turns',
    requireRole(...RECORDING_ROLES),
    emptyBody,
    validateBody(TURN_BODY),
    async (req, res) => {
      const { note } = req.body as { note?: string };
      const batch = await records.turnBatch(
        lotOf(req),
        note?.trim() || null,
        changeBy(req, context),
      );
      res.status(201).json({ batch });
    },
  );

  router.post(
    '/:lot/sign-off',
    requireRole('admin', 'reviewer'),
    emptyBody,
    validateBody(SIGN_OFF_BODY),
    async (req, res) => {
      const { note } = req.body as { note?: string };
      const batch = await records.signOff(lotOf(req), note?.trim() || null, changeBy(req, context));
      res.json({ batch });
    },
  );

  return router;
}

/** Resolves when the response can take more, or has closed. */
export function drained(res: Response): Promise<void> {
  return new Promise((resolve) => {
    const done = (): void => {
      res.off('drain', done);
      res.off('close', done);
      resolve();
    };
    res.on('drain', done);
    res.on('close', done);
  });
}

/**
 * GET /api/batches.csv: the filtered, sorted log as CSV for an inspector or a spreadsheet,
 * streamed page by page along the keyset so a large export never sits in memory.
 */
export function batchesCsv({ batches }: AppContext): RequestHandler {
  return async (req, res) => {
    const query = atSite(parseListQuery(req.query, false), siteOf(req));
    const stamp = new Date().toISOString().slice(0, 10);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="larderbook-batches-${stamp}.csv"`);
    res.setHeader('Cache-Control', 'no-store');
    res.write(CSV_HEADER);
    for await (const page of batches.summaryPages(query)) {
      if (res.destroyed) break;
      if (!res.write(page.map(batchCsvLine).join(''))) await drained(res);
    }
    res.end();
  };
}
