import type { NextFunction, Request, Response } from 'express';
import { personOf } from '../auth/request-person.ts';
import { AppError, badRequest } from '../http/app-error.ts';
import type { Person, Role } from '../../shared/api/person.ts';
import { SITE_HEADER, type SiteInfo } from '../../shared/api/site.ts';
import { MAIN_SITE_KEY } from './main-site.ts';
import {
  withRoles,
  type SiteRepository,
  type SiteWithRole,
  type SiteWithSiteRole,
} from './site-repository.ts';
import type { SiteScope } from './site-scope.ts';
import type { SessionPerson } from '../people/people-repository.ts';
import { deepFreeze } from '../auth/deep-freeze.ts';

/** 404 for a site the person has no role at, the same words whether it exists or not. */
export const noSuchSite = (key: string): AppError =>
  new AppError(404, 'no-such-site', `no site "${key}" of yours; GET /api/sites lists them`);

/** The site a request names: the X-Larder-Site header, else the `site` query parameter. */
function askedSite(req: Request): string | undefined {
  const header = req.get(SITE_HEADER);
  // No query string, no parameter: Express parses one afresh on every read of req.query.
  if (!req.url.includes('?')) return header?.trim();
  const query = req.query as Record<string, unknown>;
  const param = query.site;
  if (param !== undefined) {
    // The lists refuse parameters they do not know: the site is this middleware's, not theirs.
    const { site: _site, ...rest } = query;
    Object.defineProperty(req, 'query', { value: rest, configurable: true, enumerable: true });
  }
  if (header !== undefined) return header.trim();
  if (param === undefined) return undefined;
  if (typeof param !== 'string') throw badRequest('site must be given once');
  return param.trim();
}

/**
 * The site when the request names none: the person's only site, else the `main` site (or the
 * first one made when there is no `main`) when they can see it; else undefined.
 */
export function defaultSite(all: readonly SiteWithRole[]): SiteWithRole | undefined {
  const visible = all.filter((site) => site.role !== null);
  if (visible.length === 1) return visible[0];
  const first = all.find((site) => site.key === MAIN_SITE_KEY) ?? all[0];
  return first?.role ? first : undefined;
}

/**
 * Resolves the site of a signed-in request (after authenticate): the one it names, or the
 * default (defaultSite). Sets req.site, req.groupRole (the role at every site) and puts the role
 * AT THAT SITE in req.person.role, which every requireRole reads. A site the person has no role at
 * answers 404 no-such-site, as one that does not exist; no default answers 400 site-required with
 * the sites they may choose.
 */
export function resolveSite(sites: SiteRepository) {
  return (req: Request, _res: Response, next: NextFunction): void => {
    const person = personOf(req);
    // A cookie-signed request read its sites with its session (one statement): no wait for them.
    const read = req.sessionPerson;
    if (read?.sites) return keptChoice(req, read, read.sites, person, next);
    sites
      .forPerson(person)
      .then((all) => {
        applyChoice(req, chooseSite(person, all, askedSite(req)));
        next();
      })
      .catch(next);
  };
}

/** What resolveSite sets on a request: the site, the role there and the sites around it. */
interface SiteChoice {
  readonly site: SiteScope;
  readonly installSiteKeys: readonly string[];
  readonly groupRole: Role | null;
  readonly siteRoles: readonly (SiteInfo & { readonly id: number })[];
  readonly person: Person;
}

/** The most sites asked of one kept session that are remembered (a header can name anything). */
const CHOICES_PER_SESSION = 16;

/**
 * Choices made for a session's person and sites as read, by the site asked. A kept session
 * (session-cache.ts) hands every request the same read, frozen, until anything is committed:
 * the same read and the same site asked make the same choice, so it is made once, frozen, and
 * shared. A new read (a role or site changed, any commit at all) is a new key.
 */
const choicesOf = new WeakMap<SessionPerson, Map<string | undefined, SiteChoice>>();

function keptChoice(
  req: Request,
  read: SessionPerson,
  sites: readonly SiteWithSiteRole[],
  person: Person,
  next: NextFunction,
): void {
  const asked = askedSite(req);
  // Only a kept read (frozen by session-cache.ts) comes again; a fresh one (PostgreSQL, a first
  // read) is chosen for once, with nothing remembered.
  if (!Object.isFrozen(read)) {
    applyChoice(req, chooseSite(person, withRoles(person, sites), asked));
    return next();
  }
  let choices = choicesOf.get(read);
  if (!choices) choicesOf.set(read, (choices = new Map()));
  let choice = choices.get(asked);
  if (!choice) {
    // A refusal throws, and so is never remembered.
    choice = deepFreeze(chooseSite(person, withRoles(person, sites), asked));
    if (choices.size < CHOICES_PER_SESSION) choices.set(asked, choice);
  }
  applyChoice(req, choice);
  next();
}

function applyChoice(req: Request, choice: SiteChoice): void {
  req.site = choice.site;
  req.installSiteKeys = choice.installSiteKeys;
  req.groupRole = choice.groupRole;
  req.siteRoles = choice.siteRoles;
  req.person = choice.person;
}

/** Picks the request's site among all of them, with the person's role at each (resolveSite). */
function chooseSite(person: Person, all: SiteWithRole[], asked: string | undefined): SiteChoice {
  const chosen =
    asked === undefined ? defaultSite(all) : all.find((s) => s.key === asked && s.role !== null);
  if (asked !== undefined && !chosen) throw noSuchSite(asked);
  const visible = all.filter((site): site is SiteWithRole & { role: Role } => site.role !== null);
  if (!chosen?.role) {
    if (visible.length === 0)
      throw new AppError(403, 'no-site', 'you have a role at no site; ask an admin for one');
    throw new AppError(
      400,
      'site-required',
      `say which site: ${visible.map((s) => s.key).join(', ')} (the ${SITE_HEADER} header or ?site=)`,
      visible.map((site) => ({ key: site.key, name: site.name, role: site.role })),
    );
  }
  return {
    site: { id: chosen.id, key: chosen.key, name: chosen.name, filters: all.length > 1 },
    installSiteKeys: all.map((site) => site.key),
    groupRole: person.roleEverywhere === false ? null : person.role,
    siteRoles: visible.map((site) => ({
      id: site.id,
      key: site.key,
      name: site.name,
      role: site.role,
    })),
    person: { ...person, role: chosen.role },
  };
}
