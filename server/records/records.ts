// The back end's one door to the records: the API's routers and the larder command both keep
// records through it. It loads light; the database stack and the PDF stack load when first used.
import type { SiteScope } from '../sites/site-scope.ts';
import type { Site } from '../sites/site-repository.ts';
import type { SiteAtWork } from './records-sites.ts';
import type { Transaction } from 'sequelize';
import type {
  CatalogueReading,
  FormulaLibrary,
  PlanResult,
  PlanStock,
  PresentedPlan,
  PresentedResult,
  UnitSystem,
} from '../../shared/index.ts';
import type { AuditRepository } from '../audit/audit-repository.ts';
import { MIN_PASSWORD_LENGTH } from '../auth/passwords.ts';
import type { Batch, BatchPage, BatchStatus } from '../../shared/api/batch-record.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import type { BatchRepository } from '../batches/batch-repository.ts';
import type { RecordRequest } from '../batches/prepare-batch.ts';
import { lotCodeOf, listBatches, showBatch } from '../batches/read-batches.ts';
import { recordBatch } from '../batches/record-batch.ts';
import { loadConfig } from '../config.ts';
import type { Database } from '../db/database.ts';
import type { FormulaHistory } from '../formulas/formula-history.ts';
import type { SheetRecord, SheetSource } from '../pdf/batch-sheet-pdf.ts';
import type { LabelSize } from '../../shared/labels/label-sizes.ts';
import type { ProductLabel } from '../../shared/labels/product-label.ts';
import type { Formula } from '../../shared/index.ts';
import { formulaAtRevision } from '../formulas/formula-at-revision.ts';
import {
  addPerson,
  usernameTaken,
  type AuditedBy,
  type NewPersonRequest,
} from '../people/add-person.ts';
import type { PeopleRepository } from '../people/people-repository.ts';
import type { Person, Role } from '../../shared/api/person.ts';
import { mustFindPerson, resetPassword, type PersonKey } from '../people/reset-password.ts';
import { comparePlanWithStock } from '../plans/plan-stock-check.ts';
import { PlanRepository } from '../plans/plan-repository.ts';
import { recordPlan } from '../plans/record-plan.ts';
import type { PlanListItem } from '../../shared/api/plan-record.ts';
import type { ProducedReport, ReportFormat, ReportRequest } from '../reports/produce-report.ts';
import { REPORT_ROLES } from '../reports/report-roles.ts';
import type {
  Refusal,
  StartRequest,
  WeighingAnswer,
  WeighingRequest,
} from '../../shared/api/process-record.ts';
import { startBatch, type StartAnswer } from '../batches/start-batch.ts';
import { listRefusals } from '../process/refusals.ts';
import {
  addWeighings,
  correctWeighing,
  type WeighingCorrection,
} from '../process/weighing-writes.ts';
import { RecordsError, recordsErrorOf } from './records-error.ts';
import type {
  Receipt,
  ReceiptPage,
  ReceiptRequest,
  ReceivingItem,
  StockView,
} from '../../shared/api/receipt.ts';
import type { ReceiptQuery } from '../stock/receipt-reads.ts';
import type { StockUseCases } from '../stock/stock-records.ts';
import type {
  Deviation,
  ProcessNow,
  ProcessRecord,
  ReadingAnswer,
  ReadingRequest,
  ReadingSource,
  Verification,
} from '../../shared/api/process-record.ts';
import type { ActionRequest } from '../process/corrective-actions.ts';
import type { ProcessDeps } from '../process/judge-and-open.ts';
import type { UploadAnswer } from '../process/logger-upload.ts';
import type { ProcessUseCases } from '../process/process-writes.ts';
import type { CorrectionRequest } from '../process/reading-writes.ts';
import type { TraceAnswer, TraceSearch } from '../../shared/api/trace-record.ts';
import type { ProducedRecall, RecallFormat, RecallRequest } from '../trace/produce-recall.ts';
import type { TraceSites } from '../trace/trace-sites.ts';

export { RecordsError, type RecordsFailure } from './records-error.ts';
export { failureOfStatus } from '../http/failure-status.ts';
export type {
  AuditedBy,
  Batch,
  BatchPage,
  NewPersonRequest,
  Person,
  PersonKey,
  RecordRequest,
  Refusal,
  Role,
  StartAnswer,
  StartRequest,
  WeighingAnswer,
  WeighingCorrection,
  WeighingRequest,
};
export type { SheetRecord, SheetSource };
export type { Site, SiteAtWork, SiteScope };
// A trace's sites from a command's site at work (a small pure module, not the trace stack).
export { traceSitesOf } from '../trace/trace-sites.ts';
export type { ProducedReport, ReportFormat, ReportRequest };
export type { ActionRequest, CorrectionRequest, UploadAnswer };
export type { ProducedRecall, RecallFormat, RecallRequest };
export type { Receipt, ReceiptPage, ReceiptQuery, ReceiptRequest, StockView };

/** The fewest characters a password may have. */
export { MIN_PASSWORD_LENGTH };

/** The roles that produce the HACCP records report. */
export { REPORT_ROLES };

/** The roles that record readings at a batch's controls (and correct them, and act on deviations). */
export const PROCESS_ROLES: readonly Role[] = ['admin', 'cook', 'reviewer'];

/** The roles that trace lots and produce recall reports: everyone signed in. */
export const TRACE_ROLES: readonly Role[] = ['admin', 'cook', 'reviewer'];

/** The roles that record batches and plans; every role reads the log. */
export const RECORDING_ROLES: readonly Role[] = ['admin', 'cook'];

/** What record keeping works with: the database, its repositories and the formulas' history. */
export interface RecordsDeps {
  readonly db: Database;
  readonly audit: AuditRepository;
  readonly people: PeopleRepository;
  readonly batches: BatchRepository;
  /** The formulas batches are calculated from, each revision noted as it is first used. */
  readonly history: FormulaHistory;
}

/**
 * Record keeping: batches and plans recorded, the batch log read, people and their passwords.
 * Every failure is a {@link RecordsError}, which the API answers with an HTTP status and the
 * command with an exit code; anything else is a fault (a database that cannot be written).
 */
export class Records {
  constructor(private readonly deps: RecordsDeps) {}

  /** Records one batch calculated from its formula's current revision; refused over a critical limit. */
  recordBatch(request: RecordRequest, today: string, by: ChangeOptions): Promise<Batch> {
    return this.guard(() => recordBatch(request, today, this.deps, by));
  }

  /**
   * Records every batch of a plan as planned, all or nothing; earliest start first. Refused
   * (conflict 'plan-already-recorded', with the batches) when batches are already recorded for the
   * same menu item and day of service, unless `again`.
   */
  recordPlan(
    plan: PlanResult,
    units: UnitSystem,
    by: ChangeOptions & { readonly again?: boolean },
  ): Promise<Batch[]> {
    return this.guard(() =>
      recordPlan(plan, units, by.actor.id, { ...this.deps, plans: this.plans() }, by),
    );
  }

  /** Notes a plan as made (the first time it is worked out), for the list of plans. */
  planMade(plan: PlanResult, by: ChangeOptions): Promise<void> {
    return this.guard(() => this.plans().made(plan, by));
  }

  /** The latest plans made at the site (no site: anywhere), newest first, recorded or not. */
  listPlans(site?: SiteScope): Promise<PlanListItem[]> {
    return this.guard(() => this.plans().list(site));
  }

  /**
   * A plan's pull list against the lots on hand, or why it cannot be compared (no catalogue, a
   * catalogue with errors, no delivery recorded yet). Reads only.
   * @param formulas the formulas the plan was made from, by id
   */
  planStock(
    plan: PlanResult,
    formulas: FormulaLibrary,
    catalogue: CatalogueReading | undefined,
    units: UnitSystem,
    site?: SiteScope,
  ): Promise<PlanStock> {
    return this.guard(() =>
      comparePlanWithStock(this.deps.db, plan, formulas, catalogue, units, site),
    );
  }

  private planRepository: PlanRepository | undefined;

  private plans(): PlanRepository {
    this.planRepository ??= new PlanRepository(this.deps.db, this.deps.audit);
    return this.planRepository;
  }

  /**
   * A page of the batch log, filtered and sorted as the query says (formula, status, from…), of
   * the site's batches (no site: the whole log, as on a single-site install).
   */
  listBatches(query: Record<string, unknown>, site?: SiteScope): Promise<BatchPage> {
    return this.guard(() => listBatches(query, this.deps.batches, site));
  }

  /** One batch with its events, by lot code in either case; another site's is not found. */
  showBatch(lot: string, site?: SiteScope): Promise<Batch> {
    return this.guard(() => showBatch(lot, this.deps.batches, site));
  }

  /**
   * The formula a batch was calculated from, at that revision (for its product label);
   * undefined when the history no longer keeps that revision.
   */
  async formulaOf(batch: Batch): Promise<Formula | undefined> {
    const at = await formulaAtRevision(this.deps.history, batch.formula.id, batch.formula.revision);
    return at?.formula;
  }

  /** Moves a batch along its status machine under the workflow rules. */
  changeStatus(
    lot: string,
    to: BatchStatus,
    reason: string | null,
    by: ChangeOptions,
  ): Promise<Batch> {
    return this.guard(async () => {
      const code = lotCodeOf(lot);
      // Done is past every step: a control not met by then is missed, in the same write.
      const p = to === 'done' ? await this.processRecords() : undefined;
      const finish = p && (await p.use.finishing(p, code, by));
      return this.deps.batches.changeStatus(code, to, reason, by, finish);
    });
  }

  /** Signs a batch off, with an optional note. */
  signOff(lot: string, note: string | null, by: ChangeOptions): Promise<Batch> {
    return this.guard(() => this.deps.batches.signOff(lotCodeOf(lot), note, by));
  }

  /** Records that a curing batch was turned today by the person making the change. */
  turnBatch(lot: string, note: string | null, by: ChangeOptions): Promise<Batch> {
    return this.guard(() => this.deps.batches.turn(lotCodeOf(lot), note, by));
  }

  // Weights as weighed, starting a planned batch, refused calculations (the process record).

  /** Records lines and a stage weight as weighed; deviations open where the weights miss a limit. */
  addWeighings(lot: string, request: WeighingRequest, by: ChangeOptions): Promise<WeighingAnswer> {
    return this.guard(() => addWeighings(this.deps, lot, request, by));
  }

  /** Corrects one weighing with a new entry that says why; the old one is kept. */
  correctWeighing(
    id: number,
    correction: WeighingCorrection,
    by: ChangeOptions,
  ): Promise<WeighingAnswer> {
    return this.guard(() => correctWeighing(this.deps, id, correction, by));
  }

  /** Starts a planned batch on what is really there; refused (and recorded) over a critical limit. */
  startBatch(
    lot: string,
    request: StartRequest,
    today: string,
    by: ChangeOptions,
  ): Promise<StartAnswer> {
    return this.guard(() => startBatch(lot, request, today, this.deps, by));
  }

  /** The calculations refused over a critical limit from one day to another (both included). */
  listRefusals(range: { from?: string; to?: string }, site?: SiteScope): Promise<Refusal[]> {
    return this.guard(() => listRefusals(this.deps.db, range, site));
  }

  // Process records (HACCP): the readings at each control, their corrections, logger files,
  // corrective actions and the verification that releases a batch, judged at `by.at` (the
  // server's clock) or now. The process stack loads on first use, with the database's.
  private process?: Promise<ProcessDeps & { readonly use: ProcessUseCases }>;

  /** The process records' repository and use cases, built on first use. */
  processRecords(): Promise<ProcessDeps & { readonly use: ProcessUseCases }> {
    this.process ??= import('../process/process-writes.ts').then((m) => ({
      ...m.processDeps(this.deps),
      use: m.processWrites,
    }));
    return this.process;
  }

  /** Runs a process use case with the process records, its failures in record keeping's terms. */
  private withProcess<T>(
    work: (p: ProcessDeps & { readonly use: ProcessUseCases }) => Promise<T>,
  ): Promise<T> {
    return this.guard(async () => work(await this.processRecords()));
  }

  /** A batch's process record judged at `now` (ISO). */
  processRecord(lot: string, now: string = new Date().toISOString()): Promise<ProcessRecord> {
    return this.withProcess((p) => p.process.record(lotCodeOf(lot), now));
  }

  /** A batch's process record judged at `now` (ISO), as the API sends it: UTF-8 JSON in pieces. */
  processRecordJson(lot: string, now: string = new Date().toISOString()): Promise<Buffer[]> {
    return this.withProcess((p) => p.process.recordJson(lotCodeOf(lot), now));
  }

  /** Records a reading at a control; deviations open for new misses in the same write. */
  addReading(
    lot: string,
    request: ReadingRequest,
    source: ReadingSource,
    by: ChangeOptions,
  ): Promise<ReadingAnswer> {
    return this.withProcess((p) => p.use.addReading(p, lotCodeOf(lot), request, source, by));
  }

  /** Corrects a reading with a new one and a reason; the old one stays, marked corrected. */
  correctReading(
    id: number,
    request: CorrectionRequest,
    source: ReadingSource,
    by: ChangeOptions,
  ): Promise<ReadingAnswer> {
    return this.withProcess((p) => p.use.correctReading(p, id, request, source, by));
  }

  /** Stores a data logger's CSV as readings of one control, all or nothing. */
  uploadReadings(
    lot: string,
    control: string,
    text: string,
    by: ChangeOptions,
  ): Promise<UploadAnswer> {
    return this.withProcess((p) => p.use.uploadReadings(p, lotCodeOf(lot), control, text, by));
  }

  /** Records the corrective action that closes a deviation (or replaces its action, with a reason). */
  recordAction(deviation: number, request: ActionRequest, by: ChangeOptions): Promise<Deviation> {
    return this.withProcess((p) => p.use.recordAction(p, deviation, request, by));
  }

  /** Verifies a finished batch's records and releases it. */
  verify(lot: string, note: string | null, by: ChangeOptions): Promise<Verification> {
    return this.withProcess((p) =>
      p.use.verifyBatch(p, lotCodeOf(lot), note, this.deps.batches.rules, by),
    );
  }

  /** What needs attention now across the batches being made (at the site, when one is given). */
  processNow(now: string = new Date().toISOString(), site?: SiteScope): Promise<ProcessNow> {
    return this.withProcess((p) => p.use.processNow(p.process, now, site));
  }

  // Receiving and stock by lot. The stock code loads on first use, with the process records'.
  private stock?: Promise<StockUseCases>;

  private stockRecords(): Promise<StockUseCases> {
    this.stock ??= Promise.all([this.processRecords(), import('../stock/stock-records.ts')]).then(
      ([p, m]) => m.stockUseCases(p, this.deps.history.folder),
    );
    return this.stock;
  }

  private withStock<T>(work: (s: StockUseCases) => Promise<T>): Promise<T> {
    return this.guard(async () => work(await this.stockRecords()));
  }

  /** Receives a delivery; over its limit it is refused, or taken in with its corrective action. */
  receive(request: ReceiptRequest, by: ChangeOptions): Promise<Receipt> {
    return this.withStock((s) => s.receive(request, by));
  }

  /** Several deliveries in one write, all or nothing (the demo's history); their lot codes. */
  receiveAll(
    deliveries: readonly { readonly request: ReceiptRequest; readonly by: ChangeOptions }[],
  ): Promise<string[]> {
    return this.withStock((s) => s.receiveAll(deliveries));
  }

  /** A page of deliveries, newest first, filtered; with a site, that site's only. */
  listReceipts(query: ReceiptQuery, site?: SiteScope): Promise<ReceiptPage> {
    return this.withStock((s) => s.list(query, site));
  }

  /** One delivery by the kitchen's lot code. */
  showReceipt(lot: string): Promise<Receipt> {
    return this.withStock((s) => s.show(lot));
  }

  /** What is on hand by item on a day, first to expire first; with a site, that site's lots. */
  stockOnHand(today: string, site?: SiteScope): Promise<StockView> {
    return this.withStock((s) => s.stock(today, site));
  }

  /** The catalogue's items as the receiving door shows them, with their limits. */
  receivingItems(): Promise<ReceivingItem[]> {
    return this.withStock((s) => s.items());
  }

  /** Discards what is left of a received lot, with the reason. */
  discardReceipt(lot: string, reason: string, by: ChangeOptions): Promise<Receipt> {
    return this.withStock((s) => s.discard(lot, reason, by));
  }

  /** The active person with this username and password, if there is one. */
  signIn(username: string, password: string): Promise<Person | undefined> {
    return this.guard(() => this.deps.people.authenticate(username, password));
  }

  /**
   * The site a command works at: the one named, else the default; with a person, one of theirs,
   * and the person with their role there.
   */
  siteAtWork(key: string | undefined, person?: Person): Promise<SiteAtWork> {
    // The site stack loads when first asked for, as the database's does.
    return this.guard(async () =>
      (await import('./records-sites.ts')).siteAtWork(this.deps.db, key, person),
    );
  }

  /** Every site of the install, first made first. */
  listSites(): Promise<Site[]> {
    return this.guard(async () => (await import('./records-sites.ts')).listSites(this.deps.db));
  }

  /** Adds a site of the group. */
  addSite(key: string, name: string, by: AuditedBy): Promise<Site> {
    return this.guard(async () =>
      (await import('./records-sites.ts')).addSite(this.deps, key, name, by),
    );
  }

  /** The site with this key; refused as not found when the install has none. */
  requireSite(key: string): Promise<Site> {
    return this.guard(async () =>
      (await import('./records-sites.ts')).requireSite(this.deps.db, key),
    );
  }

  /** Adds a person whose role holds at the site `key` only. */
  addPersonAtSite(request: NewPersonRequest, key: string, by: AuditedBy): Promise<Person> {
    return this.guard(async () =>
      (await import('./records-sites.ts')).addPersonAtSite(this.deps, request, key, by),
    );
  }

  /** Everyone, active or not. */
  listPeople(): Promise<Person[]> {
    return this.guard(() => this.deps.people.list());
  }

  /** The person a key names; not found when there is none. */
  person(key: PersonKey): Promise<Person> {
    return this.guard(() => mustFindPerson(key, this.deps.people));
  }

  /** Refuses a username someone has already, before a password is asked for. */
  async usernameFree(username: string): Promise<void> {
    if (await this.guard(() => this.deps.people.findByUsername(username)))
      throw usernameTaken(username);
  }

  /** Adds a person with their audit entry; `alongside` runs in the same write. */
  addPerson<T = undefined>(
    request: NewPersonRequest,
    by: AuditedBy,
    alongside?: (transaction: Transaction, added: Person) => Promise<T>,
  ): Promise<{ person: Person; alongside: T | undefined }> {
    return this.guard(() => addPerson(request, by, this.deps, alongside));
  }

  /** Sets another person's password, with its audit entry. */
  resetPassword(key: PersonKey, password: string, by: AuditedBy): Promise<void> {
    return this.guard(() => resetPassword(key, password, by, this.deps));
  }

  // Reports (process-reports).

  /**
   * The HACCP records report of a period (default the last 30 days) as PDF bytes, CSV chunks or
   * JSON, audited as produced; admins and reviewers only. The report's code loads when first asked for.
   */
  async produceReport(format: ReportFormat, request: ReportRequest): Promise<ProducedReport> {
    const { produceReport } = await import('../reports/produce-report.ts');
    return this.guard(() => produceReport(this.deps, format, request));
  }

  // Trace and recall (server/trace): loaded when first asked for.

  /**
   * Everything that went into a lot (a batch, or a received lot, which has nothing behind it);
   * kept to `sites` when given (a request on an install with several).
   */
  async traceBack(lot: string, sites?: TraceSites): Promise<TraceAnswer> {
    const { TraceReader } = await import('../trace/trace-reader.ts');
    return this.guard(() => new TraceReader(this.deps.db.sequelize, sites).back(lot));
  }

  /** Everywhere a lot or a supplier's lot went, through batches made from batches; see traceBack. */
  async traceForward(search: TraceSearch, sites?: TraceSites): Promise<TraceAnswer> {
    const { TraceReader } = await import('../trace/trace-reader.ts');
    const reader = new TraceReader(this.deps.db.sequelize, sites);
    return this.guard(async () => reader.forward(search, await reader.forwardRoots(search)));
  }

  /** The recall report of a supplier lot, a received lot or a batch, audited as produced. */
  async produceRecall(format: RecallFormat, request: RecallRequest): Promise<ProducedRecall> {
    const { produceRecall } = await import('../trace/produce-recall.ts');
    return this.guard(() => produceRecall(this.deps, format, request));
  }

  /** The kitchen's name on reports: LARDER_KITCHEN, as the server's messages name it. */
  static kitchenName(): string {
    return loadConfig().kitchenName;
  }

  /**
   * Writes a consistent copy of the whole database to `file` while others may write: SQLite's
   * VACUUM INTO copies from one read transaction without stopping writers.
   */
  async copyTo(file: string): Promise<void> {
    await this.deps.db.sequelize.query('VACUUM INTO ?', { replacements: [file] });
  }

  /** Closes the database. */
  close(): Promise<void> {
    return this.deps.db.close();
  }

  /** Runs a use case with its failures in record keeping's terms. */
  private async guard<T>(work: () => Promise<T>): Promise<T> {
    try {
      return await work();
    } catch (error) {
      throw recordsErrorOf(error);
    }
  }
}

/**
 * The database file this machine's records are kept in, found as the server finds it
 * (LARDER_DATA, LARDER_DB).
 */
export function recordsFile(): string {
  try {
    return loadConfig().databaseFile;
  } catch (error) {
    throw new RecordsError('bad-input', 'bad-settings', (error as Error).message);
  }
}

/**
 * Opens this machine's records — the database the server uses, found through the same settings —
 * for the command line; close them when done.
 * @param formulasFolder where the formulas of recorded batches are read (default: the server's)
 */
export async function openRecords(formulasFolder?: string): Promise<Records> {
  recordsFile();
  const { openLocalRecords } = await import('./open-records.ts');
  return openLocalRecords(loadConfig(), formulasFolder);
}

/** A batch sheet as PDF bytes: a recorded batch's with its lot code, or a plain calculation's. */
export async function batchSheetPdf(
  result: PresentedResult,
  record?: SheetRecord,
  source?: SheetSource,
): Promise<Buffer> {
  return (await import('../pdf/batch-sheet-pdf.ts')).renderBatchSheetPdf(result, record, source);
}

/** A product label as PDF bytes at a thermal label's size; pdfkit loads on first use. */
export async function labelPdf(label: ProductLabel, size: LabelSize): Promise<Buffer> {
  return (await import('../pdf/label-pdf.ts')).renderLabelPdf(label, size);
}

/** A plan on paper as PDF bytes: an overview, then one production sheet per start day. */
export async function planSheetPdf(plan: PresentedPlan): Promise<Buffer> {
  return (await import('../pdf/plan-sheet-pdf.ts')).renderPlanSheetPdf(plan);
}
