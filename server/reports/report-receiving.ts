import type { ReportReceipt } from '../../shared/api/haccp-report.ts';
import { readRows } from '../db/read-row.ts';
import { andSite } from '../sites/site-scope.ts';
import type { ReceiptRow } from '../stock/receipt-rows.ts';
import { ACTION_SELECT, DEVIATION_SELECT } from './haccp-queries.ts';
import type { Sequelize } from 'sequelize';
import { correctedByOf, toAction, toDeviation } from '../process/process-rows.ts';
import type { ReportPeriod } from './report-period.ts';
import { groupBy, type ReportActionRow, type ReportDeviationRow } from './report-rows.ts';

/** The columns of a delivery the report reads. */
type ReceivingRow = Pick<
  ReceiptRow,
  | 'id'
  | 'lot_code'
  | 'item'
  | 'item_name'
  | 'supplier'
  | 'supplier_lot'
  | 'establishment'
  | 'received_at'
  | 'person_id'
  | 'person_name'
  | 'temperature_c'
  | 'limit_words'
  | 'limit_source'
  | 'found'
  | 'decision'
  | 'note'
>;

/**
 * The deliveries of a period, oldest first: received (or refused) in it, or with a deviation
 * opened or a corrective action recorded in it; each with its temperature against its limit and
 * any deviation and corrective action (the receiving control).
 */
export async function reportReceiving(
  sequelize: Sequelize,
  period: ReportPeriod,
): Promise<ReportReceipt[]> {
  const span = [period.start, period.end];
  const atSite = andSite(period.site, 'r.site_id');
  const rows = await readRows<ReceivingRow>(
    sequelize,
    `SELECT r.id, r.lot_code, r.item, r.item_name, r.supplier, r.supplier_lot, r.establishment,
       r.received_at, r.person_id, p.display_name AS person_name, r.temperature_c,
       r.limit_words, r.limit_source, r.found, r.decision, r.note
     FROM receipts r LEFT JOIN people p ON p.id = r.person_id
     WHERE r.id IN (
       SELECT id FROM receipts WHERE received_at >= ? AND received_at < ?
       UNION SELECT receipt_id FROM deviations WHERE opened_at >= ? AND opened_at < ? AND receipt_id IS NOT NULL
       UNION SELECT d.receipt_id FROM corrective_actions a JOIN deviations d ON d.id = a.deviation_id
         WHERE a.recorded_at >= ? AND a.recorded_at < ? AND d.receipt_id IS NOT NULL)${atSite.sql}
     ORDER BY r.received_at, r.id`,
    [...span, ...span, ...span, ...atSite.values],
  );
  if (!rows.length) return [];
  const ids = rows.map((row) => row.id);
  const marks = ids.map(() => '?').join(', ');
  const deviations = await readRows<ReportDeviationRow & { receipt_id: number }>(
    sequelize,
    `${DEVIATION_SELECT.replace('SELECT d.id,', 'SELECT d.receipt_id, d.id,')}
     WHERE d.receipt_id IN (${marks}) ORDER BY d.receipt_id, d.id`,
    ids,
  );
  const actions = groupBy(
    await readRows<ReportActionRow>(
      sequelize,
      `${ACTION_SELECT} WHERE x.deviation_id IN
         (SELECT id FROM deviations WHERE receipt_id IN (${marks})) ORDER BY x.deviation_id, x.id`,
      ids,
    ),
    (a) => a.deviation_id,
  );
  const byReceipt = groupBy(deviations, (d) => d.receipt_id);
  return rows.map((row) => ({
    lotCode: row.lot_code,
    item: row.item,
    itemName: row.item_name,
    supplier: row.supplier,
    supplierLot: row.supplier_lot,
    establishment: row.establishment,
    receivedAt: row.received_at,
    by: row.person_name === null ? null : { id: row.person_id, displayName: row.person_name },
    temperatureC: row.temperature_c,
    limit: row.limit_words ?? 'not recorded',
    limitSource: row.limit_source,
    found: row.found ?? 'not recorded',
    decision: row.decision,
    note: row.note,
    deviations: (byReceipt.get(row.id) ?? []).map((d) => {
      const its = actions.get(d.id) ?? [];
      const corrected = correctedByOf(its);
      return toDeviation(
        d,
        its.map((a) => toAction(a, corrected)),
      );
    }),
  }));
}
