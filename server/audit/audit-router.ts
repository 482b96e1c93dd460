import { Router } from 'express';
import type { AppContext } from '../app-context.ts';
import { requireGroupRole } from '../auth/authenticate.ts';
import { badRequest } from '../http/app-error.ts';
import { allowQuery } from '../http/require-json.ts';
import { AUDIT_ACTIONS, type AuditAction, type AuditPage } from '../../shared/api/audit-event.ts';

/** A whole number from a query parameter, or undefined when it is absent or not one. */
function wholeNumber(text: unknown): number | undefined {
  return typeof text === 'string' && /^[1-9]\d{0,15}$/.test(text) ? Number(text) : undefined;
}

/** An instant from a query parameter in ISO 8601 with its zone, as UTC; undefined when not one. */
function instant(text: unknown): string | undefined {
  if (typeof text !== 'string' || !/^\d{4}-\d{2}-\d{2}T[\d:.]+(Z|[+-]\d{2}:\d{2})$/.test(text))
    return undefined;
  const time = Date.parse(text);
  return Number.isNaN(time) ? undefined : new Date(time).toISOString();
}

/** A short text filter (a username, a lot code, a formula id); undefined when absent. */
function shortText(name: string, text: unknown): string | undefined {
  if (text === undefined) return undefined;
  if (typeof text !== 'string' || text.trim() === '' || text.length > 200)
    throw badRequest(`${name} must be a text of 1 to 200 characters`);
  return text.trim();
}

/**
 * GET /api/audit: the audit log, newest first, for admins. ?before=ID pages back; ?action=,
 * ?actor= (a username), ?subject= (a lot code, formula id or username), ?from= and ?to= (ISO
 * 8601 instants; from inclusive, to exclusive) filter.
 */
export function auditRouter({ audit }: AppContext): Router {
  const router = Router();
  router.get(
    '/',
    // One log for the group: its admins read it.
    requireGroupRole('admin'),
    allowQuery('limit', 'before', 'action', 'actor', 'subject', 'from', 'to'),
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
      const from = req.query.from === undefined ? undefined : instant(req.query.from);
      if (req.query.from !== undefined && from === undefined)
        throw badRequest('from must be a date and time with its zone, e.g. 2026-12-03T00:00:00Z');
      const to = req.query.to === undefined ? undefined : instant(req.query.to);
      if (req.query.to !== undefined && to === undefined)
        throw badRequest('to must be a date and time with its zone, e.g. 2026-12-04T00:00:00Z');
      const events = await audit.list({
        limit,
        before,
        action: action as AuditAction | undefined,
        actor: shortText('actor', req.query.actor),
        subject: shortText('subject', req.query.subject),
        from,
        to,
      });
      res.json({
        events,
        next: events.length === limit ? events[events.length - 1].id : null,
      } satisfies AuditPage);
    },
  );
  return router;
}
