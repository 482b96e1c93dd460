import type { LotUse, TraceCut, TraceNode, TracedLot } from '../../shared/api/trace-record.ts';
import { totalsByMeasure } from './lot-amounts.ts';
import { MOST_LEVELS } from './trace-sql.ts';

/** A lot in a walk: "r12" a received lot, "b34" a batch, by row id. */
export type LotKey = `r${number}` | `b${number}`;

/** A link of a walk, from the lot nearer the root to the lot one level further. */
export interface TraceEdge {
  readonly from: LotKey;
  readonly to: LotKey;
  readonly use: LotUse;
}

/** What a tree is built from: its roots, the links a walk read, and every lot they name. */
export interface TreeParts {
  readonly roots: readonly LotKey[];
  readonly edges: readonly TraceEdge[];
  readonly lots: ReadonlyMap<LotKey, TracedLot>;
  /** Per lot, its links to lots at sites not shown (trace-sites.ts), added up on its node. */
  readonly elsewhere?: ReadonlyMap<LotKey, readonly LotUse[]>;
}

/** A built tree: its roots, the distinct batches below them, and whether a branch was cut short. */
export interface BuiltTree {
  readonly roots: TraceNode[];
  readonly batches: number;
  readonly incomplete: boolean;
}

/**
 * Builds the tree of a walk, depth first in the order of the links. A lot met again is shown
 * again with its link, but its own branches only the first time ('shown-above'), so the tree
 * holds each link once however the batches share ingredients. A lot among its own ancestors is
 * a record in error: its loop is not followed ('cycle'). Nothing goes deeper than MOST_LEVELS
 * ('depth').
 */
export function buildTree({ roots, edges, lots, elsewhere }: TreeParts): BuiltTree {
  const onward = new Map<LotKey, TraceEdge[]>();
  for (const edge of edges) {
    const list = onward.get(edge.from);
    if (list) list.push(edge);
    else onward.set(edge.from, [edge]);
  }
  const expanded = new Set<LotKey>();
  const ancestors = new Set<LotKey>();
  const batches = new Set<LotKey>();
  let incomplete = false;

  const node = (key: LotKey, level: number, use?: LotUse): TraceNode | undefined => {
    const lot = lots.get(key);
    if (!lot) return undefined;
    if (level > 0 && key.startsWith('b')) batches.add(key);
    const links = onward.get(key) ?? [];
    const hidden = elsewhere?.get(key) ?? [];
    const stop: TraceCut | undefined = ancestors.has(key)
      ? 'cycle'
      : links.length === 0 && hidden.length === 0
        ? undefined
        : expanded.has(key)
          ? 'shown-above'
          : level >= MOST_LEVELS
            ? 'depth'
            : undefined;
    const base = { lot, level, ...(use ? { use } : {}) };
    if (stop) {
      if (stop !== 'shown-above') incomplete = true;
      return { ...base, children: [], cut: stop };
    }
    expanded.add(key);
    ancestors.add(key);
    const children = links.flatMap((edge) => node(edge.to, level + 1, edge.use) ?? []);
    ancestors.delete(key);
    // Said once, where the lot's branches are shown, as its links are.
    return hidden.length === 0
      ? { ...base, children }
      : { ...base, children, elsewhere: totalsByMeasure(hidden) };
  };

  const built = roots.flatMap((root) => node(root, 0) ?? []);
  return { roots: built, batches: batches.size, incomplete };
}
