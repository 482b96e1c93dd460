import { HttpClient } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { BatchPage } from '../batches/batch-types';

/**
 * How many batches wait for a reviewer's sign-off (GET /api/batches?needsSignOff=true), for the
 * board's link to the queue. The server stops counting past a thousand: `exact` says so.
 */
@Injectable({ providedIn: 'root' })
export class SignOffQueue {
  private readonly http = inject(HttpClient);
  private readonly counted = signal<{ total: number; exact: boolean } | null>(null);

  /** The count, or null until read (or when it could not be). */
  readonly count = this.counted.asReadonly();

  /** Counts the queue again; a failure leaves the link without its number. */
  async load(): Promise<void> {
    try {
      const page = await firstValueFrom(
        this.http.get<BatchPage>('/api/batches', {
          params: { needsSignOff: 'true', limit: '1' },
        }),
      );
      this.counted.set({ total: page.total, exact: page.totalExact });
    } catch {
      this.counted.set(null);
    }
  }
}
