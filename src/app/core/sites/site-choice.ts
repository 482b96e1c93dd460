import type { SITE_HEADER } from '../../../../shared/api/site.ts';
import type { SiteInfo } from '../api/api-types';

/** The header every API call names its site in (shared/api/site.ts; a type keeps them one). */
export const SITE_HEADER_NAME: typeof SITE_HEADER = 'X-Larder-Site';

/** The key of the site every install starts with (server/sites/main-site.ts). */
const MAIN_SITE = 'main';

/**
 * The site to work at: the one chosen before when it is still one of the person's sites, else
 * the server's default — `main` when it is theirs, else their first (a chosen site that was
 * removed, or whose role was taken away, falls back so).
 */
export function chooseSite(
  sites: readonly SiteInfo[],
  remembered: string | null,
): SiteInfo | undefined {
  return (
    sites.find((site) => site.key === remembered) ??
    sites.find((site) => site.key === MAIN_SITE) ??
    sites[0]
  );
}

/** Where this browser remembers a person's site: one entry per person, so a shared tablet keeps each one's. */
export function rememberedSiteKey(personId: number): string {
  return `larderbook.site.${personId}`;
}
