import { Router } from 'express';
import type { AppContext } from '../app-context.ts';
import { requireRole } from '../auth/authenticate.ts';
import { badRequest } from '../http/app-error.ts';
import { AUDIT_ACTIONS, type AuditAction } from './audit-repository.ts';
import { allowQuery } from '../http/require-json.ts';

/** GET /api/audit: the audit log, newest first, for admins. ?before=ID pages back; ?action= filters. */
export function auditRouter({ audit }: AppContext): Router {
  const router = Router();
  router.get(
    '/',
    requireRole('admin'),
    allowQuery('limit', 'before', 'action'),
    async (req, res) => {
      const limit = req.query.limit === undefined ? 100 : Number(req.query.limit);
      const before = req.query.before === undefined ? undefined : Number(req.query.before);
      if (
        !/^\d+$/.test(String(req.query.limit ?? '100')) ||
        !Number.isInteger(limit) ||
        limit < 1 ||
        limit > 500
      )
        throw badRequest('limit must be a whole number from 1 to 500');
      if (
        before !== undefined &&
        (!/^\d+$/.test(String(req.query.before)) || !Number.isInteger(before) || before < 1)
      )
        throw badRequest('before must be an event id');
      const action =
        typeof req.query.action === 'string' ? (req.query.action as AuditAction) : undefined;
      const events = await audit.list({ limit, before, action });
      res.json({ events, next: events.length === limit ? events[events.length - 1].id : null });
    },
  );
  return router;
}
