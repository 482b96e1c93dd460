import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { Batch, BatchListItem, BatchPage } from '../batches/batch-types';
import { messageOf } from '../core/api/message-of';
import { isoDateOf } from '../ui/batch-sheet/iso-day-pipe';
import { boardOf } from './board-rows';
import { holdingBatches } from './days-left';

/** Enough pages for any kitchen's cooler; the API gives at most 200 a page. */
const MAX_PAGES = 10;

/**
 * What is curing or proofing now: GET /api/batches?status=curing,proofing&sort=ready&order=asc,
 * every page, ordered overdue first with the days each has left, counted from today here; and
 * the board's quick move, marking a batch done.
 */
@Injectable({ providedIn: 'root' })
export class CuringBoard {
  private readonly http = inject(HttpClient);
  private readonly batches = signal<readonly BatchListItem[] | null>(null);
  private readonly day = signal(isoDateOf(new Date()) ?? '');
  private readonly busy = signal(false);
  private readonly failure = signal<string | null>(null);

  /** The holding batches, overdue first. */
  readonly entries = computed(() => holdingBatches(this.batches() ?? [], this.day()));
  /** How many are overdue. */
  readonly overdueCount = computed(() => this.entries().filter((e) => e.overdue).length);
  /** The daily board: cures and doughs apart, what is due today first. */
  readonly board = computed(() => boardOf(this.batches() ?? [], this.day()));
  /** How many cures owe a turn today (one missed before today included). */
  readonly turnTodayCount = computed(
    () => this.board().curing.filter((row) => row.due === 'turn').length,
  );
  /** How many are ready today. */
  readonly readyTodayCount = computed(() => this.entries().filter((e) => e.daysLeft === 0).length);
  /** The day the days are counted from, YYYY-MM-DD. */
  readonly today = this.day.asReadonly();
  /** Whether the list has arrived. */
  readonly loaded = computed(() => this.batches() !== null);
  /** Whether it is being read. */
  readonly loading = this.busy.asReadonly();
  /** Why it could not be read, or null. */
  readonly error = this.failure.asReadonly();

  /**
   * Marks a held batch done (POST /api/batches/:lot/status), then reads the board again.
   * @param reason asked of an admin moving a signed-off batch
   * @returns null when it was moved, else why not in words (a hold, someone else moved it first)
   */
  async markDone(lot: string, reason?: string): Promise<string | null> {
    try {
      await firstValueFrom(
        this.http.post(`/api/batches/${encodeURIComponent(lot)}/status`, {
          to: 'done',
          ...(reason ? { reason } : {}),
        }),
      );
      return null;
    } catch (error) {
      return messageOf(error);
    } finally {
      await this.load();
    }
  }

  /**
   * Records that a curing batch was turned today (POST /api/batches/:lot/turns) and puts the
   * turn on its card at once; someone else's turn recorded first is read in with the refusal.
   * @returns null when it was recorded, else why not in words (turned already, no longer curing)
   */
  async markTurned(lot: string): Promise<string | null> {
    try {
      const { batch } = await firstValueFrom(
        this.http.post<{ batch: Batch }>(`/api/batches/${encodeURIComponent(lot)}/turns`, {}),
      );
      const last = batch.turns?.at(-1);
      if (last) {
        const lastTurn = { on: last.on, at: last.at, by: last.by };
        this.batches.update((list) =>
          list ? list.map((item) => (item.lotCode === lot ? { ...item, lastTurn } : item)) : list,
        );
      }
      return null;
    } catch (error) {
      void this.load();
      return messageOf(error);
    }
  }

  /** Reads the list again, and counts the days from today. */
  async load(): Promise<void> {
    if (this.busy()) return;
    this.busy.set(true);
    this.failure.set(null);
    try {
      const found: BatchListItem[] = [];
      let cursor: string | null = null;
      for (let page = 0; page < MAX_PAGES; page++) {
        const params: Record<string, string> = {
          status: 'curing,proofing',
          sort: 'ready',
          order: 'asc',
          limit: '200',
          ...(cursor ? { cursor } : {}),
        };
        const answer: BatchPage = await firstValueFrom(
          this.http.get<BatchPage>('/api/batches', { params }),
        );
        found.push(...answer.items);
        cursor = answer.next;
        if (!cursor) break;
      }
      this.day.set(isoDateOf(new Date()) ?? '');
      this.batches.set(found);
    } catch (error) {
      this.failure.set(messageOf(error));
    } finally {
      this.busy.set(false);
    }
  }
}
