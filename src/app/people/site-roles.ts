import { Person, Role, SiteInfo, SiteRole } from '../core/api/api-types';
import { roleLabel } from './role-options';

/**
 * A person's roles on an install of several sites, in words and as the edit form holds them. A
 * person has a role at every site (or none), and a role at a single site wins over it there.
 */

/** The role at every site as the form offers it: one of the roles, or none anywhere. */
export type EverywhereChoice = Role | 'none';

/** A role at one site as the form offers it: one of the roles, or the role at every site. */
export type SiteChoice = Role | 'same';

/** What the edit form shows of a person's roles. */
export interface RoleChoices {
  readonly everywhere: EverywhereChoice;
  /** Each site's choice, by site key, in the order of the sites given. */
  readonly sites: Readonly<Record<string, SiteChoice>>;
}

/** The form's starting choices for a person. */
export function roleChoices(person: Person, sites: readonly SiteInfo[]): RoleChoices {
  const own = new Map((person.sites ?? []).map((site) => [site.key, site.role]));
  return {
    everywhere: person.roleEverywhere === false ? 'none' : person.role,
    sites: Object.fromEntries(sites.map((site) => [site.key, own.get(site.key) ?? 'same'])),
  };
}

/** What PATCH /api/people/:id is sent for roles: only what differs from the person now. */
export interface RoleChanges {
  role?: Role;
  roleEverywhere?: boolean;
  sites?: SiteRole[];
}

/**
 * The changes the choices make to a person's roles. A role at a single site the same as the role
 * at every site is dropped: it would change nothing, and later changes of the role at every site
 * would pass it by.
 */
export function roleChanges(person: Person, choices: RoleChoices): RoleChanges {
  const changes: RoleChanges = {};
  const everywhere = choices.everywhere;
  const wasEverywhere = person.roleEverywhere !== false;
  if (everywhere === 'none') {
    if (wasEverywhere) changes.roleEverywhere = false;
  } else if (!wasEverywhere || everywhere !== person.role) {
    changes.role = everywhere;
  }
  const sites: SiteRole[] = [];
  for (const [key, choice] of Object.entries(choices.sites))
    if (choice !== 'same' && choice !== everywhere) sites.push({ key, role: choice });
  if (!sameSiteRoles(sites, person.sites ?? [])) changes.sites = sites;
  return changes;
}

function sameSiteRoles(a: readonly SiteRole[], b: readonly SiteRole[]): boolean {
  const roles = new Map(b.map((site) => [site.key, site.role]));
  return a.length === b.length && a.every((site) => roles.get(site.key) === site.role);
}

/**
 * A person's roles in words, for the People list of an install of several sites:
 * "Cook", "Reviewer; Cook at Saltmarrow Quay shop", "Cook at Saltmarrow Quay shop only",
 * "No role at any site".
 */
export function rolesInWords(person: Person, sites: readonly SiteInfo[]): string {
  const names = new Map(sites.map((site) => [site.key, site.name]));
  const atSites = (person.sites ?? []).map(
    (site) => `${roleLabel(site.role)} at ${names.get(site.key) ?? site.key}`,
  );
  if (person.roleEverywhere !== false) return [roleLabel(person.role), ...atSites].join('; ');
  if (atSites.length === 0) return 'No role at any site';
  return atSites.length === 1 ? `${atSites[0]} only` : atSites.join('; ');
}

/** Whether the person is an admin at every site (who may manage people and sites). */
export function adminEverywhere(person: Person): boolean {
  return person.role === 'admin' && person.roleEverywhere !== false;
}
