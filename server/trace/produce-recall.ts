import type { AuditRepository } from '../audit/audit-repository.ts';
import type { Database } from '../db/database.ts';
import type { Person } from '../../shared/api/person.ts';
import type { RecallReport, TraceSearch } from '../../shared/api/trace-record.ts';
import { searchWords } from '../../shared/presentation/trace-words.ts';
import { RecordsError } from '../records/records-error.ts';
import { recallCsv } from './recall-csv.ts';
import { recallReport } from './recall-report.ts';
import { TraceReader } from './trace-reader.ts';
import type { TraceSites } from './trace-sites.ts';

/** The formats a recall report is produced in. */
export type RecallFormat = 'pdf' | 'csv' | 'json';

/** What a recall report is asked for with: the search, who asks, the kitchen, the moment. */
export interface RecallRequest {
  readonly search: TraceSearch;
  readonly by: Person;
  readonly kitchen: string;
  readonly now: Date;
  /** The address asked from, for the audit log. */
  readonly ip?: string;
  /** The sites the report keeps to (a request on an install with several); all when absent. */
  readonly sites?: TraceSites;
}

/** A recall report ready to write: its file name, and its body. */
export type ProducedRecall =
  | { readonly format: 'pdf'; readonly file: string; readonly body: Buffer }
  | { readonly format: 'csv'; readonly file: string; readonly body: string }
  | { readonly format: 'json'; readonly file: string; readonly body: RecallReport };

/**
 * The search a query names: ?lot=CODE (a received lot or a batch), or ?supplierLot=LOT with an
 * optional &supplier=NAME.
 * @throws RecordsError bad-input when it names neither or both
 */
export function searchOf(query: {
  lot?: unknown;
  supplierLot?: unknown;
  supplier?: unknown;
}): TraceSearch {
  const text = (value: unknown): string | undefined =>
    typeof value === 'string' && value.trim() ? value.trim() : undefined;
  const lot = text(query.lot);
  const supplierLot = text(query.supplierLot);
  const supplier = text(query.supplier);
  if (lot && !supplierLot && !supplier) return { lot };
  if (supplierLot && !lot) return supplier ? { supplierLot, supplier } : { supplierLot };
  throw new RecordsError(
    'bad-input',
    'bad-request',
    'name a lot code, or a supplier lot (and, if you like, its supplier), not both',
  );
}

/** A file name from the search's words: "recall-supplier-lot-4471-from-hollin-farm.pdf". */
function fileOf(search: TraceSearch, format: RecallFormat): string {
  const slug = searchWords(search)
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '')
    .slice(0, 80);
  return `recall-${slug}.${format}`;
}

/**
 * Produces the recall report of a supplier lot, a received lot or a batch: everywhere it went,
 * forward through batches made from batches. Every signed-in role may; producing it appends a
 * 'recall-produce' audit entry first, since who looked for what and when is itself a record.
 */
export async function produceRecall(
  { db, audit }: { db: Database; audit: AuditRepository },
  format: RecallFormat,
  request: RecallRequest,
): Promise<ProducedRecall> {
  const reader = new TraceReader(db.sequelize, request.sites);
  const tree = await reader.forward(request.search, await reader.forwardRoots(request.search));
  const report = recallReport(tree, {
    kitchen: request.kitchen,
    producedBy: request.by.displayName,
    producedAt: request.now.toISOString(),
    today: request.now.toISOString().slice(0, 10),
  });
  await audit.append({
    actor: request.by,
    action: 'recall-produce',
    subject: searchWords(request.search),
    detail: { format, batches: report.totals.batches },
    ...(request.ip === undefined ? {} : { ip: request.ip }),
  });
  const file = fileOf(request.search, format);
  if (format === 'json') return { format, file, body: report };
  if (format === 'csv') return { format, file, body: recallCsv(report) };
  const { renderRecallReportPdf } = await import('../pdf/recall-report-pdf.ts');
  return { format, file, body: await renderRecallReportPdf(report) };
}
