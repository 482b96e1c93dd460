import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { messageOf } from '../../core/api/message-of';
import type { BatchListItem, BatchPage } from '../batch-types';
import { nitritePoints } from './nitrite-points';

/** The most batches one request asks for (the API's ceiling). */
const PAGE = 200;
/** Enough history for a chart; older batches stay in the log and the CSV export. */
const MAX_PAGES = 10;

/**
 * The recorded batches of one cure formula, oldest first, for the nitrite chart: every page of
 * GET /api/batches?formula=…&kind=cure&sort=recorded&order=asc. Provided by the chart.
 */
@Injectable()
export class NitriteHistory {
  private readonly http = inject(HttpClient);
  private readonly batches = signal<readonly BatchListItem[] | null>(null);
  private readonly busy = signal(false);
  private readonly failure = signal<string | null>(null);
  private readonly cutShort = signal(false);
  private request = 0;

  /** The chart's points. */
  readonly points = computed(() => nitritePoints(this.batches() ?? []));
  /** Whether the batches are being read. */
  readonly loading = this.busy.asReadonly();
  /** Whether the formula's batches have arrived. */
  readonly loaded = computed(() => this.batches() !== null);
  /** Why they could not be read, or null. */
  readonly error = this.failure.asReadonly();
  /** Whether there were more batches than the chart reads (the oldest are shown). */
  readonly truncated = this.cutShort.asReadonly();

  /** Reads every recorded batch of a cure formula. */
  async load(formula: string): Promise<void> {
    const request = ++this.request;
    this.busy.set(true);
    this.failure.set(null);
    this.batches.set(null);
    const found: BatchListItem[] = [];
    let cursor: string | null = null;
    try {
      for (let page = 0; page < MAX_PAGES; page++) {
        const params: Record<string, string> = {
          formula,
          kind: 'cure',
          sort: 'recorded',
          order: 'asc',
          limit: String(PAGE),
          ...(cursor ? { cursor } : {}),
        };
        const answer: BatchPage = await firstValueFrom(
          this.http.get<BatchPage>('/api/batches', { params }),
        );
        if (request !== this.request) return;
        found.push(...answer.items);
        cursor = answer.next;
        if (!cursor) break;
      }
      this.cutShort.set(cursor !== null);
      this.batches.set(found);
    } catch (error) {
      if (request === this.request) this.failure.set(messageOf(error));
    } finally {
      if (request === this.request) this.busy.set(false);
    }
  }
}
