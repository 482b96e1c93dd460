import type { LotUse } from '../../shared/api/trace-record.ts';
import type { SiteScope } from '../sites/site-scope.ts';
import type { LotKey, TraceEdge } from './trace-tree.ts';

/**
 * The sites a trace keeps to on an install with several: its roots must be at the request's site
 * (`at`); a lot it reaches is shown, with its site's key, only at a site the asker has a role at
 * (`seen`, by site id).
 */
export interface TraceSites {
  readonly at: number;
  readonly seen: ReadonlyMap<number, string>;
}

/**
 * The TraceSites of a request: its site and the sites the person has a role at. Undefined on a
 * single-site install, where a trace shows every lot and names no site, as before sites.
 */
export function traceSitesOf(
  scope: SiteScope | undefined,
  seen: readonly { readonly id: number; readonly key: string }[] | undefined,
): TraceSites | undefined {
  if (!scope?.filters) return undefined;
  return { at: scope.id, seen: new Map((seen ?? []).map((site) => [site.id, site.key])) };
}

/** A walk's links split: those the asker may follow, and per lot its links to lots not shown. */
export interface SplitLinks {
  readonly shown: TraceEdge[];
  readonly elsewhere: Map<LotKey, LotUse[]>;
}

/**
 * Drops the links to lots at sites the asker has no role at. A link from a shown lot to a hidden
 * one becomes that lot's `elsewhere` (how much went there, never which lot); a hidden lot's own
 * links are not followed at all, so nothing beyond it is named either, not even a lot of the
 * asker's own site (that would tell which way the hidden lot went).
 * @param siteOf the site id of every lot the walk read
 */
export function splitBySite(
  edges: readonly TraceEdge[],
  siteOf: ReadonlyMap<LotKey, number>,
  sites: TraceSites,
): SplitLinks {
  const shownLot = (key: LotKey): boolean => sites.seen.has(siteOf.get(key) ?? 0);
  const shown: TraceEdge[] = [];
  const elsewhere = new Map<LotKey, LotUse[]>();
  for (const edge of edges) {
    if (!shownLot(edge.from)) continue;
    if (shownLot(edge.to)) shown.push(edge);
    else elsewhere.set(edge.from, [...(elsewhere.get(edge.from) ?? []), edge.use]);
  }
  return { shown, elsewhere };
}
