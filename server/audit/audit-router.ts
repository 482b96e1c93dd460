import { Router } from 'express';
import type { AppContext } from '../app-context.ts';
import { requireRole } from '../auth/authenticate.ts';
import { badRequest } from '../http/app-error.ts';
import { allowQuery } from '../http/require-json.ts';
import { AUDIT_ACTIONS, type AuditAction, type AuditPage } from '../../shared/api/audit-event.ts';

/** A whole number from a query parameter, or undefined when it is absent or not one. */
function wholeNumber(text: unknown): number | undefined {
  return typeof text === 'string' && /^[1-9]\d{0,15}$/.test(text) ? Number(text) : undefined;
}

/** GET /api/audit: the audit log, newest first, for admins. ?before=ID pages back; ?action= filters. */
export function auditRouter({ audit }: AppContext): Router {
  const router = Router();
  router.get(
    '/',
    requireRole('admin'),
    allowQuery('limit', 'before', 'action'),
    async (req, res) => {
      const { limit: limitText, before: beforeText, action } = req.query;
      const limit = limitText === undefined ? 100 : wholeNumber(limitText);
      if (limit === undefined || limit > 500)
        throw badRequest('limit must be a whole number from 1 to 500');
      const before = beforeText === undefined ? undefined : wholeNumber(beforeText);
      if (beforeText !== undefined && before === undefined)
        throw badRequest('before must be an event id');
      if (action !== undefined && !AUDIT_ACTIONS.includes(action as AuditAction)) {
        throw badRequest(`action must be one of ${AUDIT_ACTIONS.join(', ')}`);
      }
      const events = await audit.list({ limit, before, action: action as AuditAction | undefined });
      res.json({
        events,
        next: events.length === limit ? events[events.length - 1].id : null,
      } satisfies AuditPage);
    },
  );
  return router;
}
