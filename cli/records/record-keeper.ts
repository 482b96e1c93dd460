import { Option } from 'commander';
import type { Batch, BatchPage } from '../../shared/api/batch-record.ts';
import type { HaccpReport } from '../../shared/api/haccp-report.ts';
import type { Deviation, ReadingAnswer, ReadingRequest } from '../../shared/api/process-record.ts';
import type { PlanWithStock } from '../../shared/api/plan-record.ts';
import type {
  FormulaLibrary,
  PlanResult,
  PresentedPlan,
  RawBatchOptions,
  UnitSystem,
} from '../../shared/index.ts';
import type { RecallReport, TraceAnswer, TraceSearch } from '../../shared/api/trace-record.ts';
import type { Receipt, ReceiptRequest, StockView } from '../../shared/api/receipt.ts';

/** A batch to record, as `larder calc --record` gives it. */
export interface BatchToRecord {
  readonly formula: string;
  /** The folder of the formula's file, where this machine's records read it again. */
  readonly folder: string;
  readonly batch: RawBatchOptions;
  readonly units: UnitSystem;
  /** Planned or in progress; an assembly also done (its default on its day). */
  readonly status?: 'planned' | 'in-progress' | 'done';
  readonly notes?: string;
}

/** A plan to record, as `larder plan --record` gives it. */
export interface PlanToRecord {
  readonly assembly: string;
  readonly count: number;
  readonly serviceDate: string;
  readonly units: UnitSystem;
  /** The formulas folder the plan is made from on this machine. */
  readonly folder: string;
  /** Makes the plan on this machine, from today; a server makes its own. */
  readonly plan: () => PlanResult;
  /** The formulas of the folder by id, which the plan on this machine is made from. */
  readonly formulas: () => FormulaLibrary;
  /** Record the batches even when the plan was recorded before (`--again`). */
  readonly again?: boolean;
}

/** What a logger file's upload stored: how many readings, and the deviations they opened. */
export interface UploadedReadings {
  readonly added: number;
  /** Points of the file the batch had from a logger already: not stored again. */
  readonly alreadyStored: number;
  readonly deviations: readonly Deviation[];
  /** What was stored, in words. */
  readonly message: string;
}

/** The period of a report: days YYYY-MM-DD, both optional (the last 30 days by default). */
export interface ReportPeriodOptions {
  readonly from?: string;
  readonly to?: string;
}

/** A report as produced: PDF bytes, CSV text, or the JSON. */
export type ReportOutput =
  | { readonly format: 'pdf'; readonly body: Uint8Array }
  | { readonly format: 'csv'; readonly body: string }
  | { readonly format: 'json'; readonly body: HaccpReport };

/** A recall report as produced: PDF bytes, CSV text, or the JSON. */
export type RecallOutput =
  | { readonly format: 'pdf'; readonly body: Uint8Array }
  | { readonly format: 'csv'; readonly body: string }
  | { readonly format: 'json'; readonly body: RecallReport };

/** A lot traced both ways. */
export interface TracedBothWays {
  readonly back: TraceAnswer;
  readonly forward: TraceAnswer;
}

/**
 * The batch log, kept on this machine or on a Larderbook server: the verbs use it without
 * knowing which. Failures come as the command's errors, with its exit codes.
 */
export interface RecordKeeper {
  /** The server's URL, or undefined for this machine. */
  readonly server: string | undefined;
  recordBatch(request: BatchToRecord): Promise<Batch>;
  recordPlan(request: PlanToRecord): Promise<{ plan: PresentedPlan; batches: Batch[] }>;
  /**
   * The plan as these records make it, with its pull list against their lots on hand; undefined
   * when this machine keeps no records yet. Reads only.
   */
  planStock(request: PlanToRecord): Promise<PlanWithStock | undefined>;
  listBatches(query: Record<string, string>): Promise<BatchPage>;
  showBatch(lot: string): Promise<Batch>;
  /** Records a reading at a batch's control (source: the command); misses open deviations. */
  addReading(lot: string, request: ReadingRequest): Promise<ReadingAnswer>;
  /** Stores a data logger's CSV as readings of one control, all or nothing. */
  uploadReadings(lot: string, control: string, text: string): Promise<UploadedReadings>;
  /** The HACCP records report of a period, in a format. */
  report(format: ReportOutput['format'], period: ReportPeriodOptions): Promise<ReportOutput>;
  /** Everything that went into a lot, and everywhere it went. */
  trace(lot: string): Promise<TracedBothWays>;
  /** The recall report of a supplier lot, a received lot or a batch, in a format. */
  recall(format: RecallOutput['format'], search: TraceSearch): Promise<RecallOutput>;
  /** Receives a delivery at the door, as the person signed in (admin or cook). */
  receive(request: ReceiptRequest): Promise<Receipt>;
  /** What is on hand by item, first to expire first, on today. */
  stock(): Promise<StockView>;
}

/**
 * The one place a verb's records are chosen: the server of --server, else of $LARDER_SERVER,
 * else this machine's. Each door loads when first asked for: this machine's with the database
 * stack, a server's with none of it.
 * @param option the verb's --server, if given
 */
export async function recordKeeper(
  option: string | undefined,
  site?: string,
): Promise<RecordKeeper> {
  const server = option ?? process.env.LARDER_SERVER;
  if (server) return new (await import('./server-records.ts')).ServerRecords(server, site);
  return new (await import('./local-records.ts')).LocalRecords(site);
}

/**
 * This machine's records, whatever $LARDER_SERVER says: for a verb that reads them only when
 * --server is not given.
 */
export async function localRecordKeeper(site?: string): Promise<RecordKeeper> {
  return new (await import('./local-records.ts')).LocalRecords(site);
}

/**
 * The --site option of a verb that reads or writes a site's records: the key of the site (see
 * `larder sites`); without it, the person's only site or `main`, as the API's default.
 */
export function siteOption(): Option {
  return new Option(
    '--site <key>',
    "the site of the group to work at (default: the person's only site, else main)",
  );
}

/** The --server option of a verb that reads or writes the records: `what` it does there. */
export function serverOption(what: string): Option {
  return new Option('--server <url>', `${what} (default: $LARDER_SERVER, else this machine)`);
}
