import { HttpClient } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import {
  SAFE_WORKFLOW_RULES,
  type WorkflowRules,
} from '../../../../shared/workflow/workflow-rules.ts';
import { ApiError } from '../../core/api/api-error';
import { messageOf } from '../../core/api/message-of';
import type { Batch, BatchStatus } from '../batch-types';
import type { RevisionFacts } from './revision-words';

/**
 * One batch on its page: read with its events (GET /api/batches/:lot), moved along
 * (POST …/status) and signed off (POST …/sign-off). Every change appends an event on the server;
 * the batch is read again afterwards so the timeline shows it. Provided by the batch page.
 */
@Injectable()
export class BatchStore {
  private readonly http = inject(HttpClient);
  private readonly current = signal<Batch | null>(null);
  private readonly workflow = signal<WorkflowRules>(SAFE_WORKFLOW_RULES);
  private readonly busy = signal(false);
  private readonly failure = signal<{ message: string; notFound: boolean } | null>(null);
  private readonly acting = signal(false);
  private readonly actionFailure = signal<string | null>(null);
  private readonly revisionFacts = signal<RevisionFacts | null | undefined>(undefined);
  private request = 0;

  /** The batch, with its events; null until read. */
  readonly batch = this.current.asReadonly();
  /** The kitchen's workflow rules, as the server answered with the batch. */
  readonly rules = this.workflow.asReadonly();
  /** Whether the batch is being read. */
  readonly loading = this.busy.asReadonly();
  /** Why the batch could not be read, and whether it does not exist. */
  readonly error = this.failure.asReadonly();
  /** Whether a change is on its way. */
  readonly changing = this.acting.asReadonly();
  /** Why the last change was not made, or null. */
  readonly changeError = this.actionFailure.asReadonly();
  /**
   * What the formula's history knows of the revision the batch was made from: undefined while
   * read (or when it could not be), null when the history no longer has it.
   */
  readonly revision = this.revisionFacts.asReadonly();

  /** Reads a batch by lot code. */
  async load(lot: string): Promise<void> {
    const request = ++this.request;
    this.busy.set(true);
    this.failure.set(null);
    if (this.current()?.lotCode !== lot.toUpperCase()) this.current.set(null);
    try {
      const { batch, rules } = await firstValueFrom(
        this.http.get<{ batch: Batch; rules: WorkflowRules }>(
          `/api/batches/${encodeURIComponent(lot)}`,
        ),
      );
      if (request === this.request) {
        this.workflow.set(rules);
        this.current.set(batch);
        void this.loadRevision(batch, request);
      }
    } catch (error) {
      if (request !== this.request) return;
      this.failure.set({
        message: messageOf(error),
        notFound: error instanceof ApiError && error.status === 404,
      });
    } finally {
      if (request === this.request) this.busy.set(false);
    }
  }

  /** Reads the formula revision's record (GET /api/formulas/:id/revisions/:revision). */
  private async loadRevision(batch: Batch, request: number): Promise<void> {
    const { id, revision } = batch.formula;
    try {
      const facts = await firstValueFrom(
        this.http.get<RevisionFacts>(
          `/api/formulas/${encodeURIComponent(id)}/revisions/${encodeURIComponent(revision)}`,
        ),
      );
      if (request === this.request) this.revisionFacts.set(facts);
    } catch (error) {
      if (request !== this.request) return;
      this.revisionFacts.set(error instanceof ApiError && error.status === 404 ? null : undefined);
    }
  }

  /**
   * Moves the batch to another status; discarding needs a reason.
   * @returns whether the move was made
   */
  move(to: BatchStatus, reason?: string): Promise<boolean> {
    return this.change('status', { to, ...(reason ? { reason } : {}) });
  }

  /**
   * Signs the batch off, once, with an optional note.
   * @returns whether it was signed off
   */
  signOff(note?: string): Promise<boolean> {
    return this.change('sign-off', note ? { note } : {});
  }

  private async change(path: 'status' | 'sign-off', body: object): Promise<boolean> {
    const lot = this.current()?.lotCode;
    if (!lot || this.acting()) return false;
    this.acting.set(true);
    this.actionFailure.set(null);
    try {
      await firstValueFrom(this.http.post<{ batch: Batch }>(`/api/batches/${lot}/${path}`, body));
      return true;
    } catch (error) {
      // 409: someone else moved or signed it first; the batch is read again below to show that.
      this.actionFailure.set(messageOf(error));
      return false;
    } finally {
      await this.load(lot);
      this.acting.set(false);
    }
  }
}
