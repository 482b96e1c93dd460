import { HttpClient } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { TraceAnswer, TraceSearch } from '../../../shared/api/trace-record.ts';
import { messageOf } from '../core/api/message-of';

/** A search's answer: the trace back (for a lot) and the trace forward. */
export interface TraceResult {
  readonly search: TraceSearch;
  readonly back: TraceAnswer | null;
  readonly forward: TraceAnswer;
}

/**
 * Traces over /api/trace: for a lot, back (what went into it) and forward (where it went); for
 * a supplier's lot, forward from every delivery of it.
 */
@Injectable({ providedIn: 'root' })
export class TraceStore {
  private readonly http = inject(HttpClient);
  private readonly answer = signal<TraceResult | null>(null);
  private readonly busy = signal(false);
  private readonly failure = signal<string | null>(null);

  /** The last search's answer, or null. */
  readonly result = this.answer.asReadonly();
  /** Whether a search is being answered. */
  readonly loading = this.busy.asReadonly();
  /** Why the last search could not be answered, or null. */
  readonly error = this.failure.asReadonly();

  /** Runs a search; a failure (no such lot) is kept in `error`, never thrown. */
  async trace(search: TraceSearch): Promise<void> {
    this.busy.set(true);
    this.failure.set(null);
    this.answer.set(null);
    try {
      const get = (route: string) => firstValueFrom(this.http.get<TraceAnswer>(route));
      if ('lot' in search) {
        const lot = encodeURIComponent(search.lot);
        const [back, forward] = await Promise.all([
          get(`/api/trace/back/${lot}`),
          get(`/api/trace/forward/${lot}`),
        ]);
        this.answer.set({ search, back, forward });
      } else {
        const query = new URLSearchParams({ ...search });
        this.answer.set({ search, back: null, forward: await get(`/api/trace/forward?${query}`) });
      }
    } catch (error) {
      this.failure.set(messageOf(error, 'The trace could not be read; try again.'));
    } finally {
      this.busy.set(false);
    }
  }
}
