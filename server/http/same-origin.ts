import type { Request, RequestHandler } from 'express';
import { AppError } from './app-error.ts';
import { changesState } from './changes-state.ts';

/**
 * Sec-Fetch-Site values a change may come with: the console's own pages (same-origin), or a
 * request a person started themselves (none: typed or bookmarked). "same-site" is refused too: on
 * a shared host another port or sub-domain is somebody else's page.
 */
const OWN_FETCH_SITES = new Set(['same-origin', 'none']);

/** The origin a request was addressed to, as a browser on this server's page would write it. */
function requestOrigin(req: Request): string {
  return `${req.protocol}://${req.get('host') ?? ''}`;
}

/**
 * Refuses every state-changing request that a browser says came from a page of another origin,
 * whatever it signs in with: a session cookie, or HTTP Basic credentials the browser remembered
 * for this site. Browsers mark such requests (Sec-Fetch-Site; Origin on older ones), and a page
 * cannot remove the marks. Scripts and the CLI send neither header and are let through; their
 * own rules (CSRF token, the Basic write rule) still apply.
 * @param publicUrl the address people open the console at, when set: its origin is ours too
 */
export function refuseCrossSiteWrites(publicUrl: string | null): RequestHandler {
  const publicOrigin = publicUrl ? new URL(publicUrl).origin : null;
  return (req, _res, next) => {
    if (!changesState(req)) return next();
    const fetchSite = req.get('sec-fetch-site');
    // A browser that sends Sec-Fetch-Site is believed over Origin: behind a development proxy
    // the Host header names the server, not the page.
    const ours =
      fetchSite !== undefined
        ? OWN_FETCH_SITES.has(fetchSite)
        : originIsOurs(req.get('origin'), requestOrigin(req), publicOrigin);
    if (ours) return next();
    next(
      new AppError(
        403,
        'cross-site',
        'this change came from a page of another site and was refused; make changes in the Larderbook console',
      ),
    );
  };
}

function originIsOurs(
  origin: string | undefined,
  addressed: string,
  publicOrigin: string | null,
): boolean {
  // No Origin header: not a browser's cross-origin request (browsers send it on every POST).
  if (origin === undefined) return true;
  return origin === addressed || origin === publicOrigin;
}
