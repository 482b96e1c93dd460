import { Router, type Request } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { AppContext } from '../app-context.ts';
import { MIN_PASSWORD_LENGTH } from '../auth/passwords.ts';
import { AppError } from '../http/app-error.ts';
import { allowQuery } from '../http/require-json.ts';
import { validateBody } from '../http/validate-body.ts';
import { usable } from './invitation-repository.ts';

const SET_PASSWORD_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['password'],
  properties: { password: { type: 'string', minLength: MIN_PASSWORD_LENGTH, maxLength: 256 } },
} as const;

function tokenOf(req: Request): string {
  return String(req.params.token);
}

/**
 * /api/invitations/:token, for anyone holding a link: whether it works and for whom (GET), and
 * setting the password with it, once (POST). Limited per address like sign-in, since a token
 * is a secret that could be guessed at.
 */
export function invitationsRouter(context: AppContext): Router {
  const { db, people, audit, invitations } = context;
  const router = Router();
  router.use(
    rateLimit({
      windowMs: 15 * 60 * 1000,
      limit: context.config.signInLimit,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      handler: (_req, _res, next) =>
        next(
          new AppError(
            429,
            'too-many-attempts',
            'too many tries with invitation links; wait 15 minutes and try again',
          ),
        ),
    }),
  );

  router.get('/:token', allowQuery(), async (req, res) => {
    const invitation = usable(await invitations.find(tokenOf(req)));
    // Only the name: the username and the rest wait until the password is set.
    res.json({ displayName: invitation.person.displayName, expiresAt: invitation.expiresAt });
  });

  router.post('/:token', validateBody(SET_PASSWORD_BODY), async (req, res) => {
    const { password } = req.body as { password: string };
    const person = await db.write(async (transaction) => {
      // Checked again inside the write: two tries with one link cannot both pass.
      const invitation = usable(await invitations.find(tokenOf(req), transaction));
      await people.setPassword(invitation.person.id, password, transaction);
      await invitations.markUsed(transaction, invitation.id);
      await audit.append(
        {
          actor: { id: invitation.person.id, username: invitation.person.username },
          action: 'password-reset',
          subject: invitation.person.username,
          detail: { via: 'invitation' },
          ...(req.ip === undefined ? {} : { ip: req.ip }),
        },
        transaction,
      );
      return invitation.person;
    });
    // The username, for the sign-in page: whoever holds the link has just proved it.
    res.json({ username: person.username, displayName: person.displayName });
  });

  return router;
}
