import type { Transaction } from 'sequelize';
import type { Person } from '../../shared/api/person.ts';
import type { AuditRepository } from '../audit/audit-repository.ts';
import type { Database } from '../db/database.ts';
import { addPerson, type AuditedBy, type NewPersonRequest } from '../people/add-person.ts';
import type { PeopleRepository } from '../people/people-repository.ts';
import { holdRoleAtOneSite } from '../people/role-at-one-site.ts';
import { defaultSite } from '../sites/resolve-site.ts';
import { SiteRepository, type Site } from '../sites/site-repository.ts';
import type { SiteScope } from '../sites/site-scope.ts';
import { MAIN_SITE_KEY } from '../sites/main-site.ts';
import { SITE_KEY_PATTERN } from '../../shared/api/site.ts';
import { RecordsError } from './records-error.ts';

/** The site a command works at, and the person as they are there (their role at that site). */
export interface SiteAtWork {
  readonly site: SiteScope;
  readonly person?: Person;
  /** The sites whose lots a trace from here may show: the person's, or every one for nobody. */
  readonly seen: readonly { readonly id: number; readonly key: string }[];
}

const noSuchSite = (key: string): RecordsError =>
  new RecordsError(
    'not-found',
    'no-such-site',
    `no site "${key}" of yours; larder sites lists them`,
  );

/**
 * The site of a command, as the API resolves a request's: the one named (which must be the
 * person's, or exist when nobody signs in), else the person's only site or `main` (the first site
 * made when there is no `main`). The person comes back with their role at that site.
 */
export async function siteAtWork(
  db: Database,
  key: string | undefined,
  person?: Person,
): Promise<SiteAtWork> {
  const sites = new SiteRepository(db);
  const all = person
    ? await sites.forPerson(person)
    : (await sites.list()).map((site) => ({ ...site, role: null }));
  const scope = (site: Site): SiteScope => ({
    id: site.id,
    key: site.key,
    name: site.name,
    filters: all.length > 1,
  });
  if (!person) {
    const chosen =
      key === undefined
        ? (all.find((site) => site.key === MAIN_SITE_KEY) ?? all[0])
        : all.find((site) => site.key === key);
    if (!chosen) throw noSuchSite(key ?? MAIN_SITE_KEY);
    return { site: scope(chosen), seen: all };
  }
  const chosen =
    key === undefined ? defaultSite(all) : all.find((site) => site.key === key && site.role);
  if (!chosen?.role) {
    if (key !== undefined) throw noSuchSite(key);
    const theirs = all.filter((site) => site.role).map((site) => site.key);
    throw new RecordsError(
      'bad-input',
      'site-required',
      theirs.length
        ? `say which site with --site: ${theirs.join(', ')}`
        : `${person.username} has a role at no site; an admin gives one`,
    );
  }
  return {
    site: scope(chosen),
    person: { ...person, role: chosen.role },
    seen: all.filter((site) => site.role),
  };
}

/** Every site of the install, first made first. */
export function listSites(db: Database): Promise<Site[]> {
  return new SiteRepository(db).list();
}

/** Adds a site of the group, with its audit event; a key taken or malformed is refused. */
export async function addSite(
  { db, audit }: { db: Database; audit: AuditRepository },
  key: string,
  name: string,
  by: AuditedBy,
): Promise<Site> {
  if (!new RegExp(SITE_KEY_PATTERN).test(key))
    throw new RecordsError(
      'bad-input',
      'bad-site-key',
      `a site key is 1 to 32 lower-case letters, digits and dashes, not "${key}"`,
    );
  const trimmed = name.trim();
  if (!trimmed || trimmed.length > 80)
    throw new RecordsError('bad-input', 'bad-site-name', 'a site name is 1 to 80 characters');
  const sites = new SiteRepository(db);
  return db.write(async (transaction) => {
    if (await sites.byKey(key, transaction))
      throw new RecordsError('conflict', 'site-exists', `there is a site "${key}" already`);
    const site = await sites.add(key, trimmed, transaction);
    await audit.append(
      { ...by, action: 'site-add', subject: key, detail: { name: trimmed } },
      transaction,
    );
    return site;
  });
}

/** The site with this key; refused as not found (a site of the install, not only the person's). */
export async function requireSite(
  db: Database,
  key: string,
  transaction?: Transaction,
): Promise<Site> {
  const site = await new SiteRepository(db).byKey(key, transaction);
  if (!site)
    throw new RecordsError(
      'not-found',
      'no-such-site',
      `no site "${key}"; larder sites lists them`,
    );
  return site;
}

/**
 * Adds a person whose role holds at one site only (a cook at one shop), as the API's change of a
 * person's sites does: no role at every site, a role at that one, and both in the audit log.
 */
export async function addPersonAtSite(
  deps: { db: Database; audit: AuditRepository; people: PeopleRepository },
  request: NewPersonRequest,
  key: string,
  by: AuditedBy,
): Promise<Person> {
  const { alongside } = await addPerson(request, by, deps, async (transaction, added) =>
    holdRoleAtOneSite(deps, transaction, added, await requireSite(deps.db, key, transaction), by),
  );
  return alongside as Person;
}
