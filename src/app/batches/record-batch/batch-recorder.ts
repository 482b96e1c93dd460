import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { criticalFailures } from '../../../../shared/calculation/calc-result.ts';
import { ApiError } from '../../core/api/api-error';
import { messageOf } from '../../core/api/message-of';
import type { Batch, PresentedResult, RawBatchOptions, RefusedCheck } from '../batch-types';
import type { Units } from './batch-fields';

/** What the cook asks to record. */
export interface RecordRequest {
  readonly formula: string;
  readonly batch: RawBatchOptions;
  readonly units: Units;
  /** Done only for an assembly, made on its day. */
  readonly status: 'planned' | 'in-progress' | 'done';
  readonly notes?: string;
}

/** Why a batch was not recorded, in plain words. */
export interface Refusal {
  /** The server's message, or the preview's. */
  readonly message: string;
  /** The failed critical checks, each as a sentence. */
  readonly sentences: readonly string[];
  /** Whether the server refused a record (rather than the preview warning before one). */
  readonly refusedByServer: boolean;
}

/** A batch option the calculation could not use, and which box it was. */
export interface InputProblem {
  readonly message: string;
  readonly details: readonly unknown[];
  /** The API's code: 'hold-size-needed' names a box that must be filled in. */
  readonly code?: string;
}

/**
 * Recording a batch: a live preview (POST /api/formulas/:id/preview) while the cook types, and
 * the record itself (POST /api/batches). The server calculates again and is the authority; a
 * cure over its critical limit is refused there (422 'critical-limit') and nothing is written.
 * Provided by the record page.
 */
@Injectable()
export class BatchRecorder {
  private readonly http = inject(HttpClient);
  private readonly previewed = signal<PresentedResult | null>(null);
  private readonly previewBusy = signal(false);
  private readonly problem = signal<InputProblem | null>(null);
  private readonly refusedRecord = signal<Refusal | null>(null);
  private readonly saving = signal(false);
  private readonly saveFailure = signal<string | null>(null);
  private request = 0;

  /** The latest preview, or null. */
  readonly preview = this.previewed.asReadonly();
  /** Whether a preview is being calculated. */
  readonly previewing = this.previewBusy.asReadonly();
  /** Why the latest preview could not be calculated (a missing or unreadable option), or null. */
  readonly inputProblem = this.problem.asReadonly();
  /** Whether a record is on its way. */
  readonly recording = this.saving.asReadonly();
  /** A failure to record other than a refusal, or null. */
  readonly recordError = this.saveFailure.asReadonly();
  /**
   * Why this batch is (or would be) refused: the server's refusal of a record, else a preview
   * that fails a critical limit; null when nothing is refused.
   */
  readonly refusal = computed<Refusal | null>(() => {
    const refused = this.refusedRecord();
    if (refused) return refused;
    const preview = this.previewed();
    if (!preview?.critical) return null;
    const failed = criticalFailures(preview.checks);
    return {
      message: 'This batch would be refused: it fails a critical limit.',
      sentences: failed.map((c) => sentenceCase(c.sentence)),
      refusedByServer: false,
    };
  });

  /** Calculates a preview; an older preview still on its way is ignored when it arrives. */
  async calculate(formula: string, batch: RawBatchOptions, units: Units): Promise<void> {
    const request = ++this.request;
    this.refusedRecord.set(null);
    this.saveFailure.set(null);
    this.previewBusy.set(true);
    try {
      const answer = await firstValueFrom(
        this.http.post<{ result: PresentedResult }>(
          `/api/formulas/${encodeURIComponent(formula)}/preview`,
          { batch, units },
        ),
      );
      if (request !== this.request) return;
      this.previewed.set(answer.result);
      this.problem.set(null);
    } catch (error) {
      if (request !== this.request) return;
      this.previewed.set(null);
      this.problem.set({
        message: messageOf(error),
        details: error instanceof ApiError ? error.details : [],
      });
    } finally {
      if (request === this.request) this.previewBusy.set(false);
    }
  }

  /** Forgets the preview (another formula was chosen, or the boxes were emptied). */
  clear(): void {
    this.request++;
    this.previewed.set(null);
    this.previewBusy.set(false);
    this.problem.set(null);
    this.refusedRecord.set(null);
    this.saveFailure.set(null);
  }

  /**
   * Records the batch.
   * @returns the recorded batch, or null when it was refused or failed (the reason is in
   *   `refusal` or `recordError`)
   */
  async record(request: RecordRequest): Promise<Batch | null> {
    if (this.saving()) return null;
    this.saving.set(true);
    this.saveFailure.set(null);
    this.refusedRecord.set(null);
    try {
      const { batch } = await firstValueFrom(
        this.http.post<{ batch: Batch }>('/api/batches', request),
      );
      return batch;
    } catch (error) {
      if (error instanceof ApiError && error.code === 'critical-limit') {
        const checks = error.details as readonly RefusedCheck[];
        this.refusedRecord.set({
          message: 'Refused: this batch was not recorded.',
          sentences: checks.map((c) => sentenceCase(c.sentence)),
          refusedByServer: true,
        });
      } else if (
        error instanceof ApiError &&
        (error.code === 'bad-batch' || error.code === 'hold-size-needed')
      ) {
        this.problem.set({ message: error.message, details: error.details, code: error.code });
        this.saveFailure.set('Not recorded: check the batch options.');
      } else {
        this.saveFailure.set(`Not recorded: ${messageOf(error)}`);
      }
      return null;
    } finally {
      this.saving.set(false);
    }
  }
}

/** A check's sentence as a sentence: capital first letter, full stop. */
function sentenceCase(text: string): string {
  const trimmed = text.trim();
  const capital = trimmed.charAt(0).toUpperCase() + trimmed.slice(1);
  return /[.!?]$/.test(capital) ? capital : `${capital}.`;
}
