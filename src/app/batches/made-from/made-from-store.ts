import { HttpClient } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { BatchLots, LotUsesRequest } from '../../../../shared/api/batch-lots.ts';
import { messageOf } from '../../core/api/message-of';

/**
 * What one batch was made from: the lots it used, or the lots suggested first to expire first
 * (GET /api/batches/:lot/lots), and recording them (POST). Provided by the made-from section.
 */
@Injectable()
export class MadeFromStore {
  private readonly http = inject(HttpClient);
  private readonly current = signal<BatchLots | null>(null);
  private readonly failure = signal<string | null>(null);
  private readonly saving = signal(false);
  private readonly saveFailure = signal<string | null>(null);
  private request = 0;

  /** The batch's lots, or the suggestion; null until read. */
  readonly lots = this.current.asReadonly();
  /** Why they could not be read, or null. */
  readonly error = this.failure.asReadonly();
  /** Whether lots are being recorded. */
  readonly recording = this.saving.asReadonly();
  /** Why the lots were not recorded, or null. */
  readonly recordError = this.saveFailure.asReadonly();

  /** Reads what a batch was made from. */
  async load(lot: string): Promise<void> {
    const request = ++this.request;
    this.failure.set(null);
    try {
      const lots = await firstValueFrom(
        this.http.get<BatchLots>(`/api/batches/${encodeURIComponent(lot)}/lots`),
      );
      if (request === this.request) this.current.set(lots);
    } catch (error) {
      if (request === this.request) this.failure.set(messageOf(error, undefined, 'sentence'));
    }
  }

  /** Records the lots used; true when recorded (the lots are then read as they stand). */
  async record(lot: string, body: LotUsesRequest): Promise<boolean> {
    this.saving.set(true);
    this.saveFailure.set(null);
    try {
      const lots = await firstValueFrom(
        this.http.post<BatchLots>(`/api/batches/${encodeURIComponent(lot)}/lots`, body),
      );
      this.request++;
      this.current.set(lots);
      return true;
    } catch (error) {
      this.saveFailure.set(messageOf(error, undefined, 'sentence'));
      return false;
    } finally {
      this.saving.set(false);
    }
  }
}
