import { Router, type Request, type Response } from 'express';
import type { AppContext } from '../app-context.ts';
import { requireRole } from '../auth/authenticate.ts';
import { personOf } from '../auth/request-person.ts';
import { allowQuery } from '../http/require-json.ts';
import { TRACE_ROLES, type RecallFormat } from '../records/records.ts';
import { searchOf } from './produce-recall.ts';
import { traceSitesOf, type TraceSites } from './trace-sites.ts';

const CONTENT_TYPE: Readonly<Record<Exclude<RecallFormat, 'json'>, string>> = {
  pdf: 'application/pdf',
  csv: 'text/csv; charset=utf-8',
};

/** The sites a request's trace keeps to: undefined on a single-site install. */
const sitesOf = (req: Request): TraceSites | undefined => traceSitesOf(req.site, req.siteRoles);

/** sitesOf as an optional property. */
function sitesIn(req: Request): { sites?: TraceSites } {
  const sites = sitesOf(req);
  return sites ? { sites } : {};
}

/**
 * /api/trace, for everyone signed in, kept to the request's site and the sites the person has a
 * role at (server/README.md, Sites):
 * - GET /back/:lot — everything that went into a batch (or a received lot), through every level;
 * - GET /forward/:lot, or GET /forward?supplierLot=…&supplier=… — everywhere it went;
 * - GET /recall, /recall.pdf, /recall.csv ?lot=… or ?supplierLot=…&supplier=… — the recall
 *   report (JSON, PDF, CSV), written in the audit log as produced.
 */
export function traceRouter(context: AppContext): Router {
  const router = Router();
  const everyone = requireRole(...TRACE_ROLES);
  const noQuery = allowQuery();
  const searchQuery = allowQuery('lot', 'supplierLot', 'supplier');

  router.get('/back/:lot', everyone, noQuery, async (req, res) => {
    res.json(await context.records.traceBack(String(req.params['lot']), sitesOf(req)));
  });
  router.get('/forward/:lot', everyone, noQuery, async (req, res) => {
    const lot = String(req.params['lot']);
    res.json(await context.records.traceForward({ lot }, sitesOf(req)));
  });
  router.get('/forward', everyone, searchQuery, async (req, res) => {
    res.json(await context.records.traceForward(searchOf(req.query), sitesOf(req)));
  });

  const recall = (format: RecallFormat) => async (req: Request, res: Response) => {
    const produced = await context.records.produceRecall(format, {
      search: searchOf(req.query),
      by: personOf(req),
      kitchen: context.config.kitchenName,
      now: context.now(),
      ...(req.ip === undefined ? {} : { ip: req.ip }),
      ...sitesIn(req),
    });
    res.setHeader('Cache-Control', 'no-store');
    if (produced.format === 'json') return void res.json(produced.body);
    res.setHeader('Content-Type', CONTENT_TYPE[produced.format]);
    res.setHeader('Content-Disposition', `attachment; filename="${produced.file}"`);
    res.send(produced.body);
  };
  router.get('/recall', everyone, searchQuery, recall('json'));
  router.get('/recall.pdf', everyone, searchQuery, recall('pdf'));
  router.get('/recall.csv', everyone, searchQuery, recall('csv'));
  return router;
}
