import { Router, type Response } from 'express';
import type { AppContext } from '../app-context.ts';
import { personOf } from '../auth/request-person.ts';
import { allowQuery } from '../http/require-json.ts';
import { validateBody } from '../http/validate-body.ts';
import type { Person } from '../../shared/api/person.ts';
import {
  DEFAULT_CHOICES,
  PROCESS_ALERT_DEFAULTS,
  type ReminderChoices,
} from './reminder-prefs-repository.ts';

const CHOICES_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['flip', 'ready', 'overdue'],
  properties: {
    flip: { type: 'boolean' },
    ready: { type: 'boolean' },
    overdue: { type: 'boolean' },
    processAlerts: { type: 'boolean' },
  },
} as const;

/**
 * /api/people/me/reminders: the signed-in person's own reminder choices, whatever their role,
 * and whether they get process alerts (`processAlerts`, optional in a PUT: left as it is when
 * not sent). Nobody reads or changes anyone else's.
 */
export function remindersRouter({ db, reminderPrefs, audit, now }: AppContext): Router {
  const router = Router();

  const answer = async (res: Response, me: Person): Promise<void> => {
    const { choices, chosen, processAlerts } = await reminderPrefs.get(me);
    // Without an address the choices are kept, and nothing is sent until one is added.
    res.json({
      email: me.email,
      choices,
      chosen,
      defaults: DEFAULT_CHOICES[me.role],
      processAlerts,
      processAlertsDefault: PROCESS_ALERT_DEFAULTS[me.role],
    });
  };

  router.get('/', allowQuery(), async (req, res) => {
    await answer(res, personOf(req));
  });

  router.put('/', validateBody(CHOICES_BODY), async (req, res) => {
    const me = personOf(req);
    const { processAlerts, ...choices } = req.body as ReminderChoices & { processAlerts?: boolean };
    await db.write(async (transaction) => {
      await reminderPrefs.set(transaction, me.id, choices, now().toISOString());
      if (processAlerts !== undefined)
        await reminderPrefs.setProcessAlerts(transaction, me, processAlerts, now().toISOString());
      await audit.append(
        {
          actor: me,
          action: 'reminder-choices',
          subject: me.username,
          detail: processAlerts === undefined ? choices : { ...choices, processAlerts },
          ...(req.ip === undefined ? {} : { ip: req.ip }),
        },
        transaction,
      );
    });
    await answer(res, me);
  });

  return router;
}
