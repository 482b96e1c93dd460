import passport from 'passport';
import { BasicStrategy } from 'passport-http';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { AuditRepository } from '../audit/audit-repository.ts';
import { AppError, forbidden } from '../http/app-error.ts';
import type { PeopleRepository, SessionPerson } from '../people/people-repository.ts';
import type { Person, Role } from '../../shared/api/person.ts';
import type { SignIns } from './sign-ins.ts';
import './request-person.ts';

/**
 * Registers HTTP Basic sign-in for scripts and the CLI, under the same limit of attempts per
 * address as the form (SignIns); each failed attempt is audited. A password proved right is
 * remembered for a minute, so a script's requests do not each pay for scrypt; the person is
 * still read, and must be active, on every request.
 */
export function useBasicStrategy(signIns: SignIns, audit: AuditRepository): void {
  passport.use(
    new BasicStrategy(
      { passReqToCallback: true },
      (
        req: Request,
        username: string,
        password: string,
        done: (error: unknown, person?: Person | false) => void,
      ) => {
        signIns
          .check(req.ip ?? '', username, password, { remember: true, via: 'basic' })
          .then(async (person) => {
            if (!person)
              await audit.append({
                actorName: username,
                action: 'sign-in-failed',
                detail: { via: 'basic' },
                ip: req.ip,
              });
            done(null, person ?? false);
          })
          .catch(done);
      },
    ),
  );
}

/**
 * Who is asking: the session's person (looked up on every request, so a deactivated person's
 * session ends at once) or HTTP Basic credentials (see useBasicStrategy). Anonymous requests get
 * 401; an address at its limit of sign-in attempts gets 429, with Retry-After, as on the form.
 */
export function authenticate(people: PeopleRepository): RequestHandler {
  const basic = passport.authenticate('basic', {
    session: false,
    failWithError: true,
  }) as RequestHandler;
  return (req: Request, res: Response, next: NextFunction) => {
    const personId = req.session?.personId;
    if (personId !== undefined) {
      const decide = (found: SessionPerson | undefined): void => {
        // Deactivated, or the password changed since this session signed in: the session ends.
        const signedInAt = req.session.signedInAt ?? '';
        const ended =
          !found?.person.active ||
          (found.sessionsValidFrom !== null && signedInAt < found.sessionsValidFrom);
        if (!found || ended) {
          req.session.destroy(() =>
            next(new AppError(401, 'unauthenticated', 'your session has ended; sign in again')),
          );
          return;
        }
        req.person = found.person;
        req.authVia = 'session';
        next();
      };
      // Read with the session when the reader gave it (one statement), otherwise here.
      if (req.sessionPerson !== undefined) decide(req.sessionPerson ?? undefined);
      else people.findForSession(personId).then(decide).catch(next);
      return;
    }
    if (req.headers.authorization?.startsWith('Basic ')) {
      basic(req, res, (error?: unknown) => {
        // passport sets a Basic challenge on failure; a browser would answer it with its own
        // password prompt and then remember what was typed (see the anonymous case below).
        res.removeHeader('WWW-Authenticate');
        // Too many attempts, or too many sign-ins in line for their hash: say so, and when to return.
        if (error instanceof AppError) return next(error);
        if (error || !req.user) {
          next(
            new AppError(
              401,
              'unauthenticated',
              'wrong username or password, or the account is not active',
            ),
          );
          return;
        }
        req.person = req.user as Person;
        req.authVia = 'basic';
        next();
      });
      return;
    }
    // No Basic challenge: a browser would show its own password prompt and then send what was
    // typed with every request to this site, forms of other sites included. Scripts send their
    // credentials without being asked; the console signs in through its own page.
    next(new AppError(401, 'unauthenticated', 'sign in first'));
  };
}

/** Lets the request through only for the given roles; the server enforces, whatever the console shows. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    const role = req.person?.role;
    if (!role) return next(new AppError(401, 'unauthenticated', 'sign in first'));
    if (!roles.includes(role))
      return next(forbidden(`this needs the role ${roles.join(' or ')}; you are ${role}`));
    next();
  };
}

/**
 * Lets the request through only for a person with one of the roles at every site of the group
 * (managing people, sites and formulas, the group's audit log): a role at one site is not enough.
 * Before resolveSite has run (no req.groupRole yet), the stored role at every site decides.
 */
export function requireGroupRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    const person = req.person;
    if (!person) return next(new AppError(401, 'unauthenticated', 'sign in first'));
    const role =
      req.groupRole !== undefined
        ? req.groupRole
        : person.roleEverywhere === false
          ? null
          : person.role;
    if (!role || !roles.includes(role))
      return next(
        forbidden(
          `this needs the role ${roles.join(' or ')} at every site; you are ${role ?? 'not'}`,
        ),
      );
    next();
  };
}
