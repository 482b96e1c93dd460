import type {
  RecallBatch,
  RecallReport,
  TraceAnswer,
  TraceNode,
  TracedBatch,
  TracedLot,
} from '../../shared/api/trace-record.ts';
import { Decimal } from '../../shared/decimal.ts';
import { RECALL_CAUTION, RECALL_ELSEWHERE } from '../../shared/reference/recall-caution.ts';
import { totalsByMeasure } from './lot-amounts.ts';

/** The statuses of a batch still being made: what of it there is, is in the kitchen. */
const BEING_MADE: readonly string[] = ['planned', 'in-progress', 'curing', 'proofing'];

/** Who produced a report, and when. */
export interface RecallHead {
  readonly kitchen: string;
  readonly producedBy: string;
  readonly producedAt: string;
  /** Today in the kitchen, YYYY-MM-DD: a service on or after it is still to come. */
  readonly today: string;
}

/** Every batch of a tree below its roots, once, at its nearest level, with every use linking it. */
function affectedBatches(tree: TraceAnswer): RecallBatch[] {
  const found = new Map<
    string,
    { batch: TracedBatch; level: number; uses: RecallBatch['uses'][number][] }
  >();
  const visit = (node: TraceNode, parent: TracedLot | undefined): void => {
    if (parent && node.lot.kind === 'batch') {
      const seen = found.get(node.lot.lotCode) ?? { batch: node.lot, level: node.level, uses: [] };
      seen.level = Math.min(seen.level, node.level);
      if (node.use) seen.uses.push({ ...node.use, from: parent.lotCode });
      found.set(node.lot.lotCode, seen);
    }
    for (const child of node.children) visit(child, node.lot);
  };
  for (const root of tree.roots) visit(root, undefined);
  return [...found.values()]
    .map(({ batch, level, uses }) => ({ ...batch, level, uses }))
    .sort(
      (a, b) =>
        a.level - b.level ||
        a.startedOn.localeCompare(b.startedOn) ||
        a.lotCode.localeCompare(b.lotCode),
    );
}

/** Whether a node of the tree has links to lots at sites not shown. */
function reachesElsewhere(nodes: readonly TraceNode[]): boolean {
  return nodes.some((node) => node.elsewhere !== undefined || reachesElsewhere(node.children));
}

/**
 * The recall report of a trace forward: the lots recalled (its roots), every batch they reached
 * once with every use that links it, totals, and what is still on hand — received lots not used
 * up, and batches still being made or ready for a service still to come.
 */
export function recallReport(tree: TraceAnswer, head: RecallHead): RecallReport {
  const recalled = tree.roots.map((root) => root.lot);
  const batches = affectedBatches(tree);
  const receipts = recalled.flatMap((lot) => (lot.kind === 'receipt' ? [lot] : []));
  const recalledCodes = new Set(recalled.map((lot) => lot.lotCode));
  const byStatus: Record<string, number> = {};
  for (const batch of batches) byStatus[batch.status] = (byStatus[batch.status] ?? 0) + 1;
  // Straight from the recalled lots to sites not shown: the rest of the mass balance.
  const usedElsewhere = totalsByMeasure(tree.roots.flatMap((root) => root.elsewhere ?? []));
  return {
    kitchen: head.kitchen,
    searched: tree.searched,
    producedBy: head.producedBy,
    producedAt: head.producedAt,
    recalled,
    batches,
    totals: {
      batches: batches.length,
      byStatus,
      received: totalsByMeasure(receipts.filter((r) => r.decision !== 'refused')),
      used: totalsByMeasure(
        batches.flatMap((b) => b.uses.filter((use) => recalledCodes.has(use.from))),
      ),
      ...(usedElsewhere.length ? { usedElsewhere } : {}),
    },
    ...(reachesElsewhere(tree.roots) ? { elsewhere: RECALL_ELSEWHERE } : {}),
    onHand: {
      lots: receipts
        .filter(
          (r) =>
            r.emptiedOn === null &&
            r.decision !== 'refused' &&
            new Decimal(r.remaining).greaterThan(0),
        )
        .map((r) => ({ lotCode: r.lotCode, remaining: r.remaining, measure: r.measure })),
      batches: batches
        .filter(
          (b) =>
            BEING_MADE.includes(b.status) ||
            (b.status !== 'discarded' && b.serviceDay !== null && b.serviceDay >= head.today),
        )
        .map((b) => b.lotCode),
    },
    tree,
    caution: RECALL_CAUTION,
  };
}
