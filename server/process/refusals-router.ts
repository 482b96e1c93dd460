import { Router } from 'express';
import type { AppContext } from '../app-context.ts';
import { requireRole } from '../auth/authenticate.ts';
import { allowQuery } from '../http/require-json.ts';
import { siteOf } from '../auth/request-person.ts';

/** GET /api/refusals?from&to: calculations refused over a critical limit, for admins and reviewers. */
export function refusalsRouter({ records }: AppContext): Router {
  const router = Router();
  router.get('/', requireRole('admin', 'reviewer'), allowQuery('from', 'to'), async (req, res) => {
    const { from, to } = req.query as { from?: string; to?: string };
    res.json({
      refusals: await records.listRefusals(
        {
          ...(from === undefined ? {} : { from }),
          ...(to === undefined ? {} : { to }),
        },
        siteOf(req),
      ),
    });
  });
  return router;
}
