/** The key of the site every install starts with (migration 021). */
export const MAIN_SITE_KEY = 'main';

/** The first site's name when the kitchen's name is not set. */
export const DEFAULT_SITE_NAME = 'Main kitchen';

/**
 * The name migration 021 gives the first site: the kitchen's name setting (LARDER_KITCHEN, as
 * server/config.ts reads it) when one is set, else "Main kitchen".
 */
export function mainSiteName(env: NodeJS.ProcessEnv): string {
  return env.LARDER_KITCHEN?.trim().slice(0, 80) || DEFAULT_SITE_NAME;
}
