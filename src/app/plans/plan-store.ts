import { Injectable, inject, signal } from '@angular/core';
import { BatchLog } from '../batches/batch-log/batch-log';
import type { Batch } from '../batches/batch-types';
import { messageOf } from '../core/api/message-of';
import { PlanApi } from './plan-api';
import { pdfFileName } from './plan-query';
import { refusalOf, type PlanRefusalView } from './plan-refusal';
import type { AssemblyOption, PlanRequest, PresentedPlan } from './plan-types';
import { saveBlob } from '../ui/save-blob';

/**
 * The Plans page's state: the assemblies to choose from, the plan shown (or why it was refused),
 * recording its batches and downloading its PDF. Provided by the page, so every visit starts
 * fresh; a slow answer to an older request never replaces a newer one.
 */
@Injectable()
export class PlanStore {
  private readonly api = inject(PlanApi);
  private readonly log = inject(BatchLog);
  private readonly assemblyList = signal<readonly AssemblyOption[] | null>(null);
  private readonly assemblyFailure = signal<string | null>(null);
  private readonly shown = signal<{ request: PlanRequest; plan: PresentedPlan } | null>(null);
  private readonly busy = signal(false);
  private readonly refused = signal<PlanRefusalView | null>(null);
  private readonly recordedBatches = signal<readonly Batch[] | null>(null);
  private readonly recordBusy = signal(false);
  private readonly recordFailure = signal<PlanRefusalView | null>(null);
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

  /** Works out the plan for a request and shows it, or the reason it was refused. */
  async show(request: PlanRequest): Promise<void> {
    const mine = ++this.request;
    this.busy.set(true);
    this.refused.set(null);
    this.recordedBatches.set(null);
    this.recordFailure.set(null);
    this.pdfFailure.set(null);
    try {
      const plan = await this.api.plan(request);
      if (mine !== this.request) return;
      this.shown.set({ request, plan });
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
  }

  /**
   * Records every batch of the plan on screen as planned. The server works the plan out again
   * and is the authority: a refusal there records nothing, and is shown.
   */
  async record(): Promise<void> {
    const current = this.shown();
    if (!current || this.recordBusy() || this.recordedBatches()) return;
    this.recordBusy.set(true);
    this.recordFailure.set(null);
    try {
      const { batches } = await this.api.record(current.request);
      if (this.shown() !== current) return;
      this.recordedBatches.set(batches);
      this.log.invalidate();
    } catch (error) {
      this.recordFailure.set(refusalOf(error));
    } finally {
      this.recordBusy.set(false);
    }
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
