// What each API route answers a person with a role only at another site, when the request names
// the main site's records (the role matrix's own preparations, tests/helpers/api-routes.ts).
// A route of the whole group (people, the audit log) answers a site's admin 403; a new route kept
// to the site is one row more.

/**
 * - `not-found`: 404, as a record that does not exist, and nothing changes;
 * - `own-site`: answered at the person's own site, naming none of the main site's records;
 * - `group-admin`: 403, the route needs an admin at every site, and nothing changes.
 */
export type SiteOutcome = 'not-found' | 'own-site' | 'group-admin';

/** Each route kept to the site, as "METHOD /api/route" of the role matrix, with its outcome. */
export const SITE_OUTCOMES: Readonly<Record<string, SiteOutcome>> = {
  'POST /api/calc': 'own-site',
  'GET /api/formulas': 'own-site',
  'GET /api/formulas/:id': 'own-site',
  'GET /api/formulas/:id/revisions': 'own-site',
  'GET /api/formulas/:id/revisions/:revision': 'own-site',
  'GET /api/formulas/:id/diff': 'own-site',
  'POST /api/formulas/validate': 'own-site',
  'POST /api/formulas/:id/preview': 'own-site',
  'PUT /api/formulas/:id': 'group-admin',
  'POST /api/formulas': 'group-admin',
  'POST /api/formulas/upload': 'group-admin',
  'GET /api/batches': 'own-site',
  'GET /api/batches.csv': 'own-site',
  'GET /api/batches/:lot': 'not-found',
  'POST /api/batches': 'own-site',
  'POST /api/batches/:lot/status': 'not-found',
  'POST /api/batches/:lot/turns': 'not-found',
  'POST /api/batches/:lot/sign-off': 'not-found',
  'GET /api/batches/:lot/process': 'not-found',
  'POST /api/batches/:lot/readings': 'not-found',
  'POST /api/batches/:lot/readings/upload': 'not-found',
  'POST /api/readings/:id/correction': 'not-found',
  'POST /api/deviations/:id/action': 'not-found',
  'POST /api/batches/:lot/verify': 'not-found',
  'POST /api/batches/:lot/weighings': 'not-found',
  'POST /api/weighings/:id/correction': 'not-found',
  'POST /api/batches/:lot/start': 'not-found',
  'GET /api/batches/:lot/lots': 'not-found',
  'POST /api/batches/:lot/lots': 'not-found',
  'PATCH /api/equipment/:id': 'not-found',
  'POST /api/equipment/:id/readings': 'not-found',
  'POST /api/equipment/:id/calibrations': 'not-found',
  'GET /api/equipment/:id/log': 'not-found',
  'GET /api/trace/back/:lot': 'not-found',
  'GET /api/trace/forward/:lot': 'not-found',
  'GET /api/trace/forward': 'not-found',
  'GET /api/trace/recall': 'not-found',
  'GET /api/trace/recall.pdf': 'not-found',
  'GET /api/trace/recall.csv': 'not-found',
  'GET /api/receipts/:lot': 'not-found',
  'POST /api/receipts/:lot/discard': 'not-found',
  'GET /api/batches/:lot/cost': 'not-found',
  'GET /api/plans/pull-list': 'own-site',
  'GET /api/plans/:assembly/:day/cost': 'own-site',
  'GET /api/receipts': 'own-site',
  'POST /api/receipts': 'own-site',
  'GET /api/stock': 'own-site',
  'GET /api/stock/items': 'own-site',
  'GET /api/refusals': 'own-site',
  'GET /api/equipment': 'own-site',
  'POST /api/equipment': 'own-site',
  'GET /api/process/now': 'own-site',
  'GET /api/reports/haccp': 'own-site',
  'GET /api/reports/haccp.pdf': 'own-site',
  'GET /api/reports/haccp.csv': 'own-site',
  'GET /api/formulas/:id/costs': 'own-site',
  'GET /api/blends/trims': 'own-site',
  'POST /api/blends/least-cost': 'own-site',
  'GET /api/people': 'group-admin',
  'POST /api/people': 'group-admin',
  'PATCH /api/people/:id': 'group-admin',
  'POST /api/people/:id/password': 'group-admin',
  'PUT /api/people/me/password': 'own-site',
  'GET /api/audit': 'group-admin',
};
