import { Router, type Request, type Response } from 'express';
import type { AppContext } from '../app-context.ts';
import { requireRole } from '../auth/authenticate.ts';
import { personOf, siteOf } from '../auth/request-person.ts';
import { allowQuery } from '../http/require-json.ts';
import { REPORT_ROLES, type ReportFormat } from '../records/records.ts';
import { drained } from '../batches/batches-router.ts';

const CONTENT_TYPE: Readonly<Record<ReportFormat, string>> = {
  pdf: 'application/pdf',
  csv: 'text/csv; charset=utf-8',
  json: 'application/json; charset=utf-8',
};

/**
 * /api/reports: the HACCP records report of a period (?from=YYYY-MM-DD&to=YYYY-MM-DD, default
 * the last 30 days) as haccp.pdf, haccp.csv (streamed) or haccp (JSON); admins and reviewers.
 */
export function reportsRouter(context: AppContext): Router {
  const router = Router();
  const produce = (format: ReportFormat) => async (req: Request, res: Response) => {
    const site = siteOf(req);
    const report = await context.records.produceReport(format, {
      query: req.query,
      by: personOf(req),
      // A group's report is one site's records, and says which kitchen they are.
      kitchen: site.filters ? site.name : context.config.kitchenName,
      site,
      now: context.now(),
      ...(req.ip === undefined ? {} : { ip: req.ip }),
    });
    res.setHeader('Cache-Control', 'no-store');
    if (report.format === 'json') return res.json(report.body);
    res.setHeader('Content-Type', CONTENT_TYPE[report.format]);
    res.setHeader('Content-Disposition', `attachment; filename="${report.file}"`);
    // Both stream: a month's PDF is written page by page, the CSV a page of batches at a time.
    for await (const chunk of report.body) {
      if (res.destroyed) break;
      if (!res.write(chunk)) await drained(res);
    }
    res.end();
  };
  const guard = [requireRole(...REPORT_ROLES), allowQuery('from', 'to')];
  router.get('/haccp.pdf', ...guard, produce('pdf'));
  router.get('/haccp.csv', ...guard, produce('csv'));
  router.get('/haccp', ...guard, produce('json'));
  return router;
}
