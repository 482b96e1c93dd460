import { Router, type Request } from 'express';
import type { AuditRepository } from '../audit/audit-repository.ts';
import { AppError } from '../http/app-error.ts';
import { validateBody } from '../http/validate-body.ts';
import type { PeopleRepository } from '../people/people-repository.ts';
import type { DemoInfo, Person, SessionInfo, SessionState } from '../../shared/api/person.ts';
import { newCsrfToken, showsCsrfToken, wrongCsrfToken } from './csrf.ts';
import { SESSION_COOKIE } from './session.ts';
import type { SignIns } from './sign-ins.ts';
import type { SiteRepository } from '../sites/site-repository.ts';
import './request-person.ts';

const SIGN_IN_BODY = {
  type: 'object',
  additionalProperties: false,
  required: ['username', 'password'],
  properties: {
    username: { type: 'string', minLength: 1, maxLength: 64 },
    password: { type: 'string', minLength: 1, maxLength: 256 },
  },
} as const;

/** Starts a fresh session for a person: a new id (no fixation) and a new CSRF token. */
function startSession(req: Request, person: Person): Promise<string> {
  return new Promise((resolve, reject) => {
    req.session.regenerate((error) => {
      if (error) return reject(error as Error);
      req.session.personId = person.id;
      req.session.csrfToken = newCsrfToken();
      req.session.signedInAt = new Date().toISOString();
      req.session.save((saveError) =>
        saveError ? reject(saveError as Error) : resolve(req.session.csrfToken ?? ''),
      );
    });
  });
}

/**
 * /api/session: sign in with a form (POST), see who is signed in (GET: 200 signed out too), sign
 * out (DELETE); /api/session/demo: the demo's sign-ins, given only on a demo server.
 * Sign-in attempts are limited per address, together with HTTP Basic's (SignIns): 429 past the
 * limit, and only failed attempts count.
 */
export function sessionRouter(
  people: PeopleRepository,
  audit: AuditRepository,
  signIns: SignIns,
  demo: DemoInfo = { demo: false, kitchen: null, signIns: [] },
  sites?: SiteRepository,
): Router {
  // How many sites the install has: 1 tells the console never to speak of sites.
  const siteCount = async (): Promise<{ siteCount?: number }> =>
    sites ? { siteCount: await sites.count() } : {};
  const router = Router();

  router.post('/', validateBody(SIGN_IN_BODY), async (req, res) => {
    const { username, password } = req.body as { username: string; password: string };
    const person = await signIns.check(req.ip ?? '', username, password, { via: 'form' });
    if (!person) {
      await audit.append({
        actorName: username,
        action: 'sign-in-failed',
        detail: { via: 'form' },
        ip: req.ip,
      });
      throw new AppError(
        401,
        'unauthenticated',
        'wrong username or password, or the account is not active',
      );
    }
    const csrfToken = await startSession(req, person);
    await audit.append({ actor: person, action: 'sign-in', detail: { via: 'form' }, ip: req.ip });
    res.status(201).json({ person, csrfToken, ...(await siteCount()) } satisfies SessionInfo);
  });

  router.get('/', async (req, res) => {
    const personId = req.session?.personId;
    const person = personId === undefined ? undefined : await people.findById(personId);
    // Signed out is an answer, not a failure: the console asks on every load.
    if (!person?.active)
      return void res.json({ person: null, csrfToken: null } satisfies SessionState);
    res.json({
      person,
      csrfToken: req.session.csrfToken ?? '',
      ...(await siteCount()),
    } satisfies SessionState);
  });

  // Only a demo server tells its sign-ins, for its sign-in page; any other says it is not one.
  router.get('/demo', (_req, res) => {
    res.json(demo);
  });

  router.delete('/', async (req, res) => {
    const personId = req.session?.personId;
    // Signing out changes state too: a signed-in session must show its CSRF token.
    if (personId !== undefined && !showsCsrfToken(req)) throw wrongCsrfToken();
    if (personId !== undefined) {
      const person = await people.findById(personId);
      if (person) await audit.append({ actor: person, action: 'sign-out', ip: req.ip });
    }
    await new Promise<void>((resolve) =>
      req.session ? req.session.destroy(() => resolve()) : resolve(),
    );
    res.clearCookie(SESSION_COOKIE);
    res.status(204).end();
  });

  return router;
}
