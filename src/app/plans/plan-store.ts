import { Injectable, inject, signal } from '@angular/core';
import { BatchLog } from '../batches/batch-log/batch-log';
import type { Batch, BatchSummary } from '../batches/batch-types';
import { messageOf } from '../core/api/message-of';
import { PlanApi } from './plan-api';
import { pdfFileName } from './plan-query';
import { alreadyRecordedOf, refusalOf, type PlanRefusalView } from './plan-refusal';
import type { AssemblyOption, PlanListItem, PlanRequest, PlanWithStock } from './plan-types';
import { saveBlob } from '../ui/save-blob';

/**
 * The Plans page's state: the assemblies to choose from, the plans made, the plan shown (or why
 * it was refused), recording its batches (or the batches already recorded for its service) and
 * downloading its PDF. Provided by the page, so every visit starts
 * fresh; a slow answer to an older request never replaces a newer one.
 */
@Injectable()
export class PlanStore {
  private readonly api = inject(PlanApi);
  private readonly log = inject(BatchLog);
  private readonly assemblyList = signal<readonly AssemblyOption[] | null>(null);
  private readonly assemblyFailure = signal<string | null>(null);
  private readonly shown = signal<{ request: PlanRequest; plan: PlanWithStock } | null>(null);
  private readonly busy = signal(false);
  private readonly refused = signal<PlanRefusalView | null>(null);
  private readonly recordedBatches = signal<readonly Batch[] | null>(null);
  private readonly recordBusy = signal(false);
  private readonly recordFailure = signal<PlanRefusalView | null>(null);
  private readonly alreadyRecordedBatches = signal<readonly BatchSummary[] | null>(null);
  private readonly planList = signal<readonly PlanListItem[] | null>(null);
  private readonly planListFailure = signal<string | null>(null);
  private readonly pdfBusy = signal(false);
  private readonly pdfFailure = signal<string | null>(null);
  private request = 0;

  /** The assemblies by title; null until they arrive. */
  readonly assemblies = this.assemblyList.asReadonly();
  /** Why the assemblies could not be read, or null. */
  readonly assembliesError = this.assemblyFailure.asReadonly();
  /** The plan on screen and the request it answers, or null. */
  readonly current = this.shown.asReadonly();
  /** Whether a plan is being worked out. */
  readonly loading = this.busy.asReadonly();
  /** Why the latest plan was refused, or null. */
  readonly refusal = this.refused.asReadonly();
  /** The batches recorded from the plan on screen, or null before recording. */
  readonly recorded = this.recordedBatches.asReadonly();
  /** Whether the plan's batches are being recorded. */
  readonly recording = this.recordBusy.asReadonly();
  /** Why recording failed (a refusal, or a failure), or null. */
  readonly recordError = this.recordFailure.asReadonly();
  /**
   * The batches already recorded for the plan's menu item and day of service, when recording
   * was stopped to ask whether to record again; null otherwise.
   */
  readonly alreadyRecorded = this.alreadyRecordedBatches.asReadonly();
  /** The plans made, newest first, recorded or not; null until they arrive. */
  readonly plans = this.planList.asReadonly();
  /** Why the plans made could not be read, or null. */
  readonly plansError = this.planListFailure.asReadonly();
  /** Whether the PDF is being made. */
  readonly downloading = this.pdfBusy.asReadonly();
  /** Why the PDF could not be downloaded, or null. */
  readonly downloadError = this.pdfFailure.asReadonly();

  /** Reads the assemblies once. */
  async loadAssemblies(): Promise<void> {
    if (this.assemblyList() !== null) return;
    this.assemblyFailure.set(null);
    try {
      this.assemblyList.set(await this.api.assemblies());
    } catch (error) {
      this.assemblyFailure.set(messageOf(error));
    }
  }

  /** Reads the plans made (again: showing or recording one changes the list). */
  async loadPlans(): Promise<void> {
    try {
      this.planList.set(await this.api.list());
      this.planListFailure.set(null);
    } catch (error) {
      this.planListFailure.set(messageOf(error));
    }
  }

  /** Works out the plan for a request and shows it, or the reason it was refused. */
  async show(request: PlanRequest): Promise<void> {
    const mine = ++this.request;
    this.busy.set(true);
    this.refused.set(null);
    this.recordedBatches.set(null);
    this.recordFailure.set(null);
    this.alreadyRecordedBatches.set(null);
    this.pdfFailure.set(null);
    try {
      const plan = await this.api.plan(request);
      if (mine !== this.request) return;
      this.shown.set({ request, plan });
      void this.loadPlans();
    } catch (error) {
      if (mine !== this.request) return;
      this.shown.set(null);
      this.refused.set(refusalOf(error));
    } finally {
      if (mine === this.request) this.busy.set(false);
    }
  }

  /** Forgets the plan (the form no longer asks for one). */
  clear(): void {
    this.request++;
    this.busy.set(false);
    this.shown.set(null);
    this.refused.set(null);
    this.recordedBatches.set(null);
    this.recordFailure.set(null);
    this.alreadyRecordedBatches.set(null);
  }

  /**
   * Records every batch of the plan on screen as planned. The server works the plan out again
   * and is the authority: a refusal there records nothing, and is shown. When batches are
   * already recorded for the same menu item and day, nothing is recorded and they are shown
   * instead, until the cook records again (`again`) or keeps what is recorded.
   */
  async record(again = false): Promise<void> {
    const current = this.shown();
    if (!current || this.recordBusy() || this.recordedBatches()) return;
    this.recordBusy.set(true);
    this.recordFailure.set(null);
    try {
      const { batches } = await this.api.record(current.request, again);
      if (this.shown() !== current) return;
      this.alreadyRecordedBatches.set(null);
      this.recordedBatches.set(batches);
      this.log.invalidate();
      void this.loadPlans();
    } catch (error) {
      if (this.shown() !== current) return;
      const already = alreadyRecordedOf(error);
      if (already) this.alreadyRecordedBatches.set(already);
      else this.recordFailure.set(refusalOf(error));
    } finally {
      this.recordBusy.set(false);
    }
  }

  /** Keeps the batches already recorded: the warning goes, nothing is recorded. */
  keepRecorded(): void {
    this.alreadyRecordedBatches.set(null);
  }

  /** Downloads the plan on screen as a PDF of production sheets, one a day. */
  async downloadPdf(): Promise<void> {
    const current = this.shown();
    if (!current || this.pdfBusy()) return;
    this.pdfBusy.set(true);
    this.pdfFailure.set(null);
    try {
      const blob = await this.api.sheetPdf(current.request);
      saveBlob(blob, pdfFileName(current.request));
    } catch (error) {
      this.pdfFailure.set(`The PDF could not be made: ${messageOf(error)}`);
    } finally {
      this.pdfBusy.set(false);
    }
  }
}
