import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { messageOf } from '../../core/api/message-of';
import { isoDateOf } from '../../ui/batch-sheet/iso-day-pipe';
import type { BatchListItem, BatchPage, PersonRef } from '../batch-types';
import { DEFAULT_QUERY, apiFilterParams, type LogQuery } from './log-query';

/** Where the log is in its pages. */
interface Position {
  /** The cursor the shown page was read with; null for the first page. */
  readonly cursor: string | null;
  /** 0 for the first page; counts pages walked with next and prev. */
  readonly index: number;
}

/**
 * The batch log: one page of GET /api/batches at a time for a view (filters, sort, page size),
 * walked with the API's keyset cursors. Remembers the people it has seen as operators, for the
 * operator filter.
 */
@Injectable({ providedIn: 'root' })
export class BatchLog {
  private readonly http = inject(HttpClient);
  private readonly view = signal<LogQuery>(DEFAULT_QUERY);
  private readonly position = signal<Position>({ cursor: null, index: 0 });
  private readonly page = signal<BatchPage | null>(null);
  private readonly busy = signal(false);
  private readonly failure = signal<string | null>(null);
  private readonly seen = signal<ReadonlyMap<number, PersonRef>>(new Map());
  /** Counts requests, so a slow answer to an old view never replaces a newer one. */
  private request = 0;
  private loadedOnce = false;

  /** The view being shown. */
  readonly query = this.view.asReadonly();
  /** The batches of the page, in the view's order. */
  readonly items = computed<readonly BatchListItem[]>(() => this.page()?.items ?? []);
  /** How many batches match the view (or the most the server counted, when not exact). */
  readonly total = computed(() => this.page()?.total ?? 0);
  /** Whether total is the whole count; if not, more batches match than it says. */
  readonly totalExact = computed(() => this.page()?.totalExact ?? true);
  /** Whether a page is being read. */
  readonly loading = this.busy.asReadonly();
  /** Why the page could not be read, or null. */
  readonly error = this.failure.asReadonly();
  /** Whether a page has arrived for the current view. */
  readonly loaded = computed(() => this.page() !== null);
  /** Whether there is a page after this one. */
  readonly hasNext = computed(() => !!this.page()?.next);
  /** Whether there is a page before this one. */
  readonly hasPrev = computed(() => !!this.page()?.prev);
  /** Position of the first and last batch shown, counting from 1 ("26–50"). */
  readonly range = computed(() => {
    const shown = this.items().length;
    const first = this.position().index * this.view().size + 1;
    return shown === 0 ? null : { first, last: first + shown - 1 };
  });
  /** Operators seen in the log so far, by name. */
  readonly operators = computed(() =>
    [...this.seen().values()].sort((a, b) => a.displayName.localeCompare(b.displayName)),
  );

  /**
   * Shows a view: a changed view starts again at its first page; the same view (coming back to
   * the log) reads the page it was on again, so it is fresh and the place is kept.
   */
  show(query: LogQuery): void {
    if (this.loadedOnce && sameQuery(query, this.view())) {
      void this.read(this.position());
      return;
    }
    this.loadedOnce = true;
    this.view.set(query);
    void this.read({ cursor: null, index: 0 });
  }

  /** Reads the page after this one. */
  next(): void {
    const cursor = this.page()?.next;
    if (cursor) void this.read({ cursor, index: this.position().index + 1 });
  }

  /** Reads the page before this one. */
  prev(): void {
    const cursor = this.page()?.prev;
    if (cursor) void this.read({ cursor, index: Math.max(0, this.position().index - 1) });
  }

  /** Reads the shown page again (after a failure, or to see new batches). */
  reload(): void {
    void this.read(this.position());
  }

  /** Forgets the view so the next show() reads afresh (a batch was recorded or changed). */
  invalidate(): void {
    this.loadedOnce = false;
  }

  private async read(position: Position): Promise<void> {
    const request = ++this.request;
    const query = this.view();
    this.busy.set(true);
    this.failure.set(null);
    const params: Record<string, string> = {
      ...apiFilterParams(query, isoDateOf(new Date()) ?? ''),
      limit: String(query.size),
      ...(position.cursor ? { cursor: position.cursor } : {}),
    };
    try {
      const page = await firstValueFrom(this.http.get<BatchPage>('/api/batches', { params }));
      if (request !== this.request) return;
      // A page emptied under us (batches changed since the cursor was given): back to the start.
      if (page.items.length === 0 && position.index > 0) {
        void this.read({ cursor: null, index: 0 });
        return;
      }
      this.page.set(page);
      this.position.set(position);
      this.remember(page.items);
    } catch (error) {
      if (request !== this.request) return;
      this.failure.set(messageOf(error));
      // A cursor the server no longer accepts: the first page of the view still works.
      if (position.cursor) this.position.set({ cursor: null, index: 0 });
    } finally {
      if (request === this.request) this.busy.set(false);
    }
  }

  private remember(items: readonly BatchListItem[]): void {
    const known = this.seen();
    if (items.every((b) => known.has(b.operator.id))) return;
    const next = new Map(known);
    for (const batch of items) next.set(batch.operator.id, batch.operator);
    this.seen.set(next);
  }
}

function sameQuery(a: LogQuery, b: LogQuery): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}
