import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { Database } from '../db/database.ts';
import { readRows } from '../db/read-row.ts';
import { notFound } from '../http/app-error.ts';
import type { SiteScope } from './site-scope.ts';

/**
 * The site a record named in a path belongs to: SQL selecting `site_id` of the record whose key
 * is every `?`. A record that hangs off another (a reading, a weighing) has its parent's site.
 */
export const SITE_OF = {
  batch: 'SELECT site_id FROM batches WHERE lot_code = ?',
  receipt: 'SELECT site_id FROM receipts WHERE lot_code = ?',
  /** A lot code of either kind: a batch's or a delivery's (trace starts from both). */
  lot: `SELECT site_id FROM batches WHERE lot_code = ?
    UNION ALL SELECT site_id FROM receipts WHERE lot_code = ?`,
  equipment: 'SELECT site_id FROM equipment WHERE id = ?',
  reading: `SELECT COALESCE(b.site_id, e.site_id) AS site_id FROM readings r
    LEFT JOIN batches b ON b.id = r.batch_id LEFT JOIN equipment e ON e.id = r.equipment_id
    WHERE r.id = ?`,
  weighing: `SELECT b.site_id FROM weighings w JOIN batches b ON b.id = w.batch_id WHERE w.id = ?`,
  deviation: `SELECT COALESCE(b.site_id, e.site_id, r.site_id) AS site_id FROM deviations d
    LEFT JOIN batches b ON b.id = d.batch_id LEFT JOIN equipment e ON e.id = d.equipment_id
    LEFT JOIN receipts r ON r.id = d.receipt_id WHERE d.id = ?`,
} as const;

/**
 * Whether a record that exists belongs to another site than the request's (never on a
 * single-site install, where it reads nothing).
 */
export function isAtOtherSite(
  db: Database,
  kind: keyof typeof SITE_OF,
  key: string,
  site: SiteScope | undefined,
): Promise<boolean> {
  return atOtherSite(db, SITE_OF[kind], key, site);
}

async function atOtherSite(
  db: Database,
  sql: string,
  key: string,
  site: SiteScope | undefined,
): Promise<boolean> {
  if (!site?.filters) return false;
  const keys = sql
    .split('?')
    .slice(1)
    .map(() => key);
  const rows = await readRows<{ site_id: number }>(db.sequelize, sql, keys);
  return rows.length > 0 && Number(rows[0].site_id) !== site.id;
}

/**
 * Guards every route under a path that names a record (mounted at `/batches/:lot` and the like):
 * a record of another site answers 404, exactly as one that does not exist, before any route
 * reads or changes it. A key that names no record passes on, to the route's own 404 (or a route
 * of its own, such as /receipts/items). On a single-site install it reads nothing.
 * @param kind which record the path's parameter names
 * @param param the parameter's name in the mount path
 * @param upper whether the key is a lot code, which may be written in either case
 */
export function recordAtSite(
  db: Database,
  kind: keyof typeof SITE_OF,
  param: string,
  upper = false,
): RequestHandler {
  return async (req: Request, _res: Response, next: NextFunction): Promise<void> => {
    const raw = String(req.params[param] ?? '');
    const key = upper ? raw.toUpperCase() : raw;
    if (await atOtherSite(db, SITE_OF[kind], key, req.site)) throw notFound(`no ${kind} ${raw}`);
    next();
  };
}
