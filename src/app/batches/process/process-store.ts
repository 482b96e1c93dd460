import { HttpClient } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import { firstValueFrom, type Observable } from 'rxjs';
import { ApiError } from '../../core/api/api-error';
import { messageOf } from '../../core/api/message-of';
import type { Batch, RawBatchOptions } from '../batch-types';
import type {
  Deviation,
  Disposition,
  ProcessRecord,
  ReadingAnswer,
  StageName,
  Verification,
  WeighingAnswer,
} from './process-types';

/** How a write ended: its answer, or the server's words for why not. */
export type Outcome<T> =
  | { readonly ok: true; readonly value: T }
  | { readonly ok: false; readonly message: string; readonly code: string };

/** The four things a corrective action records (9 CFR 417.3(a)). */
export interface ActionRequest {
  readonly cause: string;
  readonly restored: string;
  readonly prevention: string;
  readonly disposition: Disposition;
  /** How much product, e.g. "12.4 kg"; absent when not weighed. */
  readonly grams?: string;
  /** Why an earlier action is replaced. */
  readonly reason?: string;
}

/**
 * A batch's process record (GET /api/batches/:lot/process) and every write to it: readings and
 * their corrections, weights as weighed, corrective actions, verification, starting a planned
 * batch. Records are never edited in place; after each write the record is read again so every
 * control's state is the server's. Provided by the batch page.
 */
@Injectable()
export class ProcessStore {
  private readonly http = inject(HttpClient);
  private readonly current = signal<ProcessRecord | null>(null);
  private readonly busy = signal(false);
  private readonly failure = signal<string | null>(null);
  private readonly acting = signal(false);
  private readonly stamp = signal(new Date());
  private lot: string | null = null;
  private request = 0;

  /** The record; null until read (or when the server keeps none for this batch). */
  readonly record = this.current.asReadonly();
  /** Whether it is being read. */
  readonly loading = this.busy.asReadonly();
  /** Why it could not be read, or null. */
  readonly error = this.failure.asReadonly();
  /** Whether a write is on its way. */
  readonly writing = this.acting.asReadonly();
  /** When the record was last read: the moment "due in" and "overdue" are counted from. */
  readonly readAt = this.stamp.asReadonly();

  /** Reads the record of a batch; quietly, when only refreshing the one shown. */
  async load(lot: string): Promise<void> {
    const request = ++this.request;
    const same = this.lot === lot.toUpperCase();
    this.lot = lot.toUpperCase();
    if (!same) this.current.set(null);
    this.busy.set(true);
    try {
      const record = await firstValueFrom(
        this.http.get<ProcessRecord>(`/api/batches/${encodeURIComponent(lot)}/process`),
      );
      if (request !== this.request) return;
      this.current.set(record);
      this.failure.set(null);
      this.stamp.set(new Date());
    } catch (error) {
      if (request === this.request) this.failure.set(messageOf(error));
    } finally {
      if (request === this.request) this.busy.set(false);
    }
  }

  /** Records a reading at a control; `at` is when it was taken (now when absent). */
  addReading(control: string, value: string, at?: string): Promise<Outcome<ReadingAnswer>> {
    return this.write((lot) =>
      this.http.post<ReadingAnswer>(`/api/batches/${lot}/readings`, {
        control,
        value,
        ...(at ? { at } : {}),
      }),
    );
  }

  /** Corrects a reading: a new entry that replaces it, with the reason; the old one stays. */
  correctReading(id: number, value: string, reason: string): Promise<Outcome<ReadingAnswer>> {
    return this.write(() =>
      this.http.post<ReadingAnswer>(`/api/readings/${id}/correction`, { value, reason }),
    );
  }

  /** Records the lines as weighed, or one stage weight. */
  weigh(body: {
    readonly lines?: readonly { readonly name: string; readonly weight: string }[];
    readonly stage?: { readonly name: StageName; readonly weight: string };
  }): Promise<Outcome<WeighingAnswer>> {
    return this.write((lot) =>
      this.http.post<WeighingAnswer>(`/api/batches/${lot}/weighings`, body),
    );
  }

  /** Corrects a weighing, with the reason. */
  correctWeighing(id: number, weight: string, reason: string): Promise<Outcome<WeighingAnswer>> {
    return this.write(() =>
      this.http.post<WeighingAnswer>(`/api/weighings/${id}/correction`, { weight, reason }),
    );
  }

  /** Records the corrective action that closes a deviation. */
  act(deviation: number, action: ActionRequest): Promise<Outcome<{ deviation: Deviation }>> {
    return this.write(() =>
      this.http.post<{ deviation: Deviation }>(`/api/deviations/${deviation}/action`, action),
    );
  }

  /** Verifies the batch's records, which releases it. */
  verify(note?: string): Promise<Outcome<{ verification: Verification }>> {
    return this.write((lot) =>
      this.http.post<{ verification: Verification }>(
        `/api/batches/${lot}/verify`,
        note ? { note } : {},
      ),
    );
  }

  /** Starts a planned batch on what is really there; the server calculates it again. */
  start(batch: RawBatchOptions): Promise<Outcome<{ batch: Batch; warnings?: readonly string[] }>> {
    return this.write((lot) =>
      this.http.post<{ batch: Batch; warnings?: readonly string[] }>(`/api/batches/${lot}/start`, {
        batch,
      }),
    );
  }

  private async write<T>(send: (lot: string) => Observable<T>): Promise<Outcome<T>> {
    const lot = this.lot;
    if (!lot) return { ok: false, message: 'The batch is not read yet.', code: 'not-read' };
    this.acting.set(true);
    try {
      const value = await firstValueFrom(send(encodeURIComponent(lot)));
      return { ok: true, value };
    } catch (error) {
      return {
        ok: false,
        message: messageOf(error, undefined, 'sentence'),
        code: error instanceof ApiError ? error.code : 'unknown',
      };
    } finally {
      await this.load(lot);
      this.acting.set(false);
    }
  }
}
