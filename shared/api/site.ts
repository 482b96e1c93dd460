/**
 * Sites as the API shows them (/api/sites, a person's roles per site): one definition for the
 * server, the command line and the console. The console imports these as types only.
 */
import type { Role } from './person.ts';

/** A short url-safe name of a site: lower-case letters, digits and dashes, 1–32 of them. */
export const SITE_KEY_PATTERN = '^[a-z0-9][a-z0-9-]{0,31}$';

/** The header a request names its site in (the query parameter `site` is the other way). */
export const SITE_HEADER = 'X-Larder-Site';

/** A site the signed-in person can see, with their role there. */
export interface SiteInfo {
  readonly key: string;
  readonly name: string;
  readonly role: Role;
}

/** GET /api/sites. */
export interface SiteList {
  readonly sites: readonly SiteInfo[];
}

/** A person's role at one site, which wins over their role at every site there. */
export interface SiteRole {
  readonly key: string;
  readonly role: Role;
}
