import type { SqlPart } from '../batches/batch-sql.ts';

/** The site a request or a command works at. */
export interface SiteScope {
  readonly id: number;
  readonly key: string;
  readonly name: string;
  /**
   * Whether queries must name the site: false on a single-site install, where every row is this
   * site's, so its queries (and their plans) stay as they were before sites.
   */
  readonly filters: boolean;
}

/**
 * `column = ?` for the scope's site, or nothing when it need not filter (one site, or no scope:
 * work that is the whole group's, such as the demo's seed).
 */
export function siteCondition(scope: SiteScope | undefined, column: string): SqlPart {
  return scope?.filters ? { sql: `${column} = ?`, values: [scope.id] } : { sql: '', values: [] };
}

/** ` AND column = ?` for the scope's site, or nothing, to add to a WHERE clause. */
export function andSite(scope: SiteScope | undefined, column: string): SqlPart {
  const part = siteCondition(scope, column);
  return part.sql ? { sql: ` AND ${part.sql}`, values: part.values } : part;
}

/** The id a new row of the scope's site gets; 1, the first site, when no scope is given. */
export function siteIdOf(scope: SiteScope | undefined): number {
  return scope?.id ?? 1;
}
