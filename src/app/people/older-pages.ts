import { computed, signal } from '@angular/core';
import { messageOf } from '../core/api/message-of';

/** One page of a newest-first list; `next` is the `before` of the following page, null at the end. */
export interface KeysetPage<T> {
  readonly items: readonly T[];
  readonly next: number | null;
}

interface OlderPagesState<T> {
  readonly items: readonly T[];
  readonly next: number | null;
  readonly loading: boolean;
  readonly failure: string | null;
  readonly loaded: boolean;
}

/**
 * A newest-first list read a page at a time along the API's keyset (`?before=ID`), with "older"
 * pages appended below: the signal state the audit log and the outbox share.
 */
export class OlderPages<T> {
  private readonly state = signal<OlderPagesState<T>>({
    items: [],
    next: null,
    loading: false,
    failure: null,
    loaded: false,
  });
  /** Counts requests, so an answer that a newer request overtook is dropped. */
  private request = 0;

  /** The items fetched so far, newest first. */
  readonly items = computed(() => this.state().items);
  /** Whether there are older items to fetch. */
  readonly hasMore = computed(() => this.state().next !== null);
  /** Whether a page is being fetched. */
  readonly loading = computed(() => this.state().loading);
  /** Why the last page could not be fetched, or null. */
  readonly failure = computed(() => this.state().failure);
  /** Whether the first page has come back. */
  readonly loaded = computed(() => this.state().loaded);

  /**
   * @param fetchPage Reads the page before an id (the newest page for undefined).
   * @param fallback What to say when a page cannot be fetched and the server said nothing.
   */
  constructor(
    private readonly fetchPage: (before: number | undefined) => Promise<KeysetPage<T>>,
    private readonly fallback: string,
  ) {}

  /** Starts again from the newest page; a failure is kept in `failure`, never thrown. */
  async load(): Promise<void> {
    this.state.set({ items: [], next: null, loading: true, failure: null, loaded: false });
    await this.fetch(undefined);
  }

  /** Fetches the page of older items after the last one shown. */
  async loadMore(): Promise<void> {
    const { next, loading } = this.state();
    if (next === null || loading) return;
    this.state.update((state) => ({ ...state, loading: true, failure: null }));
    await this.fetch(next);
  }

  private async fetch(before: number | undefined): Promise<void> {
    const request = ++this.request;
    try {
      const page = await this.fetchPage(before);
      if (request !== this.request) return;
      this.state.update((state) => ({
        ...state,
        items: [...state.items, ...page.items],
        next: page.next,
        loading: false,
        loaded: true,
      }));
    } catch (error) {
      if (request !== this.request) return;
      const failure = messageOf(error, this.fallback, 'sentence');
      this.state.update((state) => ({ ...state, loading: false, failure }));
    }
  }
}
