import type { AuditRepository } from '../audit/audit-repository.ts';
import type { Database } from '../db/database.ts';
import type { FormulaHistory } from '../formulas/formula-history.ts';
import { FormulaControls } from '../process/formula-controls.ts';
import { kitchenTimeZone } from '../process/kitchen-clock.ts';
import type { HaccpReport, ReportHead } from '../../shared/api/haccp-report.ts';
import type { Person } from '../../shared/api/person.ts';
import type { SiteScope } from '../sites/site-scope.ts';
import { RecordsError } from '../records/records-error.ts';
import {
  HACCP_CSV_HEADER,
  batchCsv,
  equipmentCsv,
  headCsv,
  receivingCsv,
  refusalsCsv,
} from './haccp-csv.ts';
import { reportReceiving } from './report-receiving.ts';
import { periodBatchIds } from './haccp-queries.ts';
import {
  haccpReport,
  reportBatches,
  reportEquipment,
  reportRefusals,
  type ReportSource,
} from './haccp-report.ts';
import { reportPeriod, type ReportPeriod } from './report-period.ts';
import { REPORT_ROLES } from './report-roles.ts';

/** The formats a report is produced in. */
export type ReportFormat = 'pdf' | 'csv' | 'json';

/** What a report is asked for with: the period, who asks, the kitchen's name, the moment. */
export interface ReportRequest {
  readonly query: { from?: unknown; to?: unknown };
  readonly by: Person;
  readonly kitchen: string;
  readonly now: Date;
  /** The address asked from, for the audit log. */
  readonly ip?: string;
  /** The site whose records the report holds; none: every record. */
  readonly site?: SiteScope;
}

/** A report ready to write: its name, and its body as chunks (PDF bytes, CSV text) or JSON. */
export type ProducedReport =
  | { readonly format: 'pdf'; readonly file: string; readonly body: AsyncIterable<Buffer> }
  | { readonly format: 'csv'; readonly file: string; readonly body: AsyncIterable<string> }
  | { readonly format: 'json'; readonly file: string; readonly body: HaccpReport };

async function* csvChunks(source: ReportSource, period: ReportPeriod, head: ReportHead) {
  yield HACCP_CSV_HEADER + headCsv(head);
  const ids = await periodBatchIds(source.sequelize, period);
  for await (const batch of reportBatches(source, ids)) yield batchCsv(batch);
  yield refusalsCsv(await reportRefusals(source, period));
  yield equipmentCsv(await reportEquipment(source, period));
  yield receivingCsv(await reportReceiving(source.sequelize, period));
}

/**
 * Produces the HACCP records report of a period in a format, and appends its 'report-produce'
 * audit entry first: who produced which period in what form is itself a record. Only admins
 * and reviewers produce it.
 */
export async function produceReport(
  { db, audit, history }: { db: Database; audit: AuditRepository; history: FormulaHistory },
  format: ReportFormat,
  request: ReportRequest,
): Promise<ProducedReport> {
  if (!REPORT_ROLES.includes(request.by.role))
    throw new RecordsError(
      'forbidden',
      'forbidden',
      `${request.by.username} is a ${request.by.role}; the HACCP report needs ${REPORT_ROLES.join(' or ')}`,
    );
  const period = {
    ...reportPeriod(request.query, request.now),
    ...(request.site ? { site: request.site } : {}),
  };
  const head: ReportHead = {
    kitchen: request.kitchen,
    from: period.from,
    to: period.to,
    timeZone: kitchenTimeZone(),
    producedBy: request.by.displayName,
    producedAt: request.now.toISOString(),
  };
  const controls = new FormulaControls(history);
  const source: ReportSource = {
    sequelize: db.sequelize,
    controls: (formulaId, revision) => controls.of(formulaId, revision),
    clock: { now: head.producedAt, timeZone: head.timeZone },
  };
  const ids = format === 'csv' ? null : await periodBatchIds(db.sequelize, period);
  await audit.append({
    actor: request.by,
    action: 'report-produce',
    subject: `${period.from}..${period.to}`,
    detail: { format, from: period.from, to: period.to, ...(ids ? { batches: ids.length } : {}) },
    ...(request.ip === undefined ? {} : { ip: request.ip }),
  });
  const file = `haccp-records-${period.from}-to-${period.to}.${format}`;
  if (format === 'csv') return { format, file, body: csvChunks(source, period, head) };
  if (format === 'json') return { format, file, body: await haccpReport(source, period, head) };
  const { renderHaccpReportPdf } = await import('../pdf/haccp-report-pdf.ts');
  const { body } = await renderHaccpReportPdf({
    head,
    batches: reportBatches(source, ids ?? []),
    refusals: () => reportRefusals(source, period),
    equipment: () => reportEquipment(source, period),
    receiving: () => reportReceiving(db.sequelize, period),
  });
  return { format, file, body };
}
