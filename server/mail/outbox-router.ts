import { Router } from 'express';
import type { OutboxPage } from '../../shared/api/outbox-message.ts';
import type { AppContext } from '../app-context.ts';
import { requireGroupRole } from '../auth/authenticate.ts';
import { badRequest, notFound } from '../http/app-error.ts';
import { allowQuery } from '../http/require-json.ts';

/** A whole number from a query parameter or route, or undefined when it is not one. */
function wholeNumber(text: unknown): number | undefined {
  return typeof text === 'string' && /^[1-9]\d{0,15}$/.test(text) ? Number(text) : undefined;
}

/**
 * /api/outbox, for admins: every message Larderbook has sent or kept, newest first
 * (?before=ID pages back), and one message with its text and HTML.
 */
export function outboxRouter({ mail }: AppContext): Router {
  const router = Router();
  router.use(requireGroupRole('admin'));

  router.get('/', allowQuery('limit', 'before'), async (req, res) => {
    const { limit: limitText, before: beforeText } = req.query;
    const limit = limitText === undefined ? 50 : wholeNumber(limitText);
    if (limit === undefined || limit > 200)
      throw badRequest('limit must be a whole number from 1 to 200');
    const before = beforeText === undefined ? undefined : wholeNumber(beforeText);
    if (beforeText !== undefined && before === undefined)
      throw badRequest('before must be a message id');
    const messages = await mail.outbox.list({ limit, before });
    res.json({
      messages,
      next: messages.length === limit ? messages[messages.length - 1].id : null,
      transport: mail.mailer.transport,
    } satisfies OutboxPage);
  });

  router.get('/:id', allowQuery(), async (req, res) => {
    const id = wholeNumber(req.params.id);
    const message = id === undefined ? undefined : await mail.outbox.get(id);
    if (!message) throw notFound(`no message with id ${String(req.params.id)}`);
    res.json({ message });
  });

  return router;
}
