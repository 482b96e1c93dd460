import type { RecallReport, TraceNode } from '../../shared/api/trace-record.ts';
import { csvLine } from '../batches/batch-csv.ts';

/** The columns of a recall's CSV: one record per recalled lot, then one per use of each batch. */
const HEADER = [
  'record',
  'level',
  'lot_code',
  'product',
  'supplier',
  'supplier_lot',
  'establishment',
  'status',
  'received_or_started_on',
  'ready_on',
  'service_day',
  'made_from',
  'amount',
  'measure',
  'used_on',
  'remaining',
  'on_hand',
];

/**
 * One record per lot of the tree with links to sites not shown: how much went there from it, the
 * lot it went to unnamed (record "elsewhere", lot_code empty, made_from the lot it came from).
 */
function elsewhereLines(nodes: readonly TraceNode[], lines: string[]): void {
  for (const node of nodes) {
    if (!node.cut)
      for (const away of node.elsewhere ?? [])
        lines.push(
          csvLine([
            'elsewhere',
            node.level + 1,
            ...Array<null>(9).fill(null),
            node.lot.lotCode,
            away.amount,
            away.measure,
            null,
            null,
            null,
          ]),
        );
    elsewhereLines(node.children, lines);
  }
}

/**
 * A recall report as CSV (RFC 4180, CRLF): the lots recalled with what is left of them, then every
 * affected batch once per use that links it to the recall, with the amount and the day used, then
 * what went to sites of the group the asker has no role at, unnamed.
 */
export function recallCsv(report: RecallReport): string {
  const onHand = new Set([
    ...report.onHand.lots.map((lot) => lot.lotCode),
    ...report.onHand.batches,
  ]);
  const lines = [csvLine(HEADER)];
  for (const lot of report.recalled) {
    lines.push(
      lot.kind === 'receipt'
        ? csvLine([
            'recalled lot',
            0,
            lot.lotCode,
            lot.itemName,
            lot.supplier,
            lot.supplierLot,
            lot.establishment,
            lot.decision,
            lot.receivedOn,
            null,
            null,
            null,
            lot.amount,
            lot.measure,
            null,
            lot.remaining,
            onHand.has(lot.lotCode) ? 'yes' : 'no',
          ])
        : csvLine([
            'recalled lot',
            0,
            lot.lotCode,
            lot.formula.title,
            null,
            null,
            null,
            lot.status,
            lot.startedOn,
            lot.readyOn,
            lot.serviceDay,
            null,
            null,
            null,
            null,
            null,
            null,
          ]),
    );
  }
  for (const batch of report.batches)
    for (const use of batch.uses)
      lines.push(
        csvLine([
          'batch',
          batch.level,
          batch.lotCode,
          batch.formula.title,
          null,
          null,
          null,
          batch.status,
          batch.startedOn,
          batch.readyOn,
          batch.serviceDay,
          use.from,
          use.amount,
          use.measure,
          use.usedOn,
          null,
          onHand.has(batch.lotCode) ? 'yes' : 'no',
        ]),
      );
  elsewhereLines(report.tree.roots, lines);
  return lines.join('');
}
