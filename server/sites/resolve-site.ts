import type { NextFunction, Request, Response } from 'express';
import { personOf } from '../auth/request-person.ts';
import { AppError, badRequest } from '../http/app-error.ts';
import type { Person, Role } from '../../shared/api/person.ts';
import { SITE_HEADER } from '../../shared/api/site.ts';
import { MAIN_SITE_KEY } from './main-site.ts';
import { withRoles, type SiteRepository, type SiteWithRole } from './site-repository.ts';

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
    const read = req.sessionPerson?.sites;
    if (read) return atSite(req, person, withRoles(person, read), next);
    sites
      .forPerson(person)
      .then((all) => atSite(req, person, all, next))
      .catch(next);
  };
}

/** Picks the request's site among all of them, with the person's role at each (resolveSite). */
function atSite(req: Request, person: Person, all: SiteWithRole[], next: NextFunction): void {
  const asked = askedSite(req);
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
  req.site = { id: chosen.id, key: chosen.key, name: chosen.name, filters: all.length > 1 };
  req.installSiteKeys = all.map((site) => site.key);
  req.groupRole = person.roleEverywhere === false ? null : person.role;
  req.siteRoles = visible.map((site) => ({
    id: site.id,
    key: site.key,
    name: site.name,
    role: site.role,
  }));
  req.person = { ...person, role: chosen.role };
  next();
}
