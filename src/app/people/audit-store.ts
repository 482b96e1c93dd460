import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { AuditAction, AuditEvent, AuditPage } from './audit-event';
import { failureText } from './failure-text';

/** How many entries one page of the log holds. */
const PAGE_SIZE = 50;

interface AuditState {
  readonly events: readonly AuditEvent[];
  /** The `before` of the next page; null when there is none. */
  readonly next: number | null;
  /** The action shown, or null for all. */
  readonly action: AuditAction | null;
  readonly loading: boolean;
  readonly failure: string | null;
  readonly loaded: boolean;
}

/** The audit log for admins: newest first, a page at a time, optionally one action only. */
@Injectable({ providedIn: 'root' })
export class AuditStore {
  private readonly http = inject(HttpClient);
  private readonly state = signal<AuditState>({
    events: [],
    next: null,
    action: null,
    loading: false,
    failure: null,
    loaded: false,
  });
  /** Counts requests, so an answer that a newer request overtook is dropped. */
  private request = 0;

  /** The entries fetched so far, newest first. */
  readonly events = computed(() => this.state().events);
  /** The action filter, or null for all actions. */
  readonly action = computed(() => this.state().action);
  /** Whether there are older entries to fetch. */
  readonly hasMore = computed(() => this.state().next !== null);
  /** Whether a page is being fetched. */
  readonly loading = computed(() => this.state().loading);
  /** Why the last page could not be fetched, or null. */
  readonly failure = computed(() => this.state().failure);
  /** Whether the first page has come back. */
  readonly loaded = computed(() => this.state().loaded);

  /** Fetches the newest page, for all actions or for one; failures are kept in `failure`. */
  async load(action: AuditAction | null = this.state().action): Promise<void> {
    this.state.set({
      events: [],
      next: null,
      action,
      loading: true,
      failure: null,
      loaded: false,
    });
    await this.fetch(undefined);
  }

  /** Fetches the page of older entries after the last one shown. */
  async loadMore(): Promise<void> {
    const { next, loading } = this.state();
    if (next === null || loading) return;
    this.state.update((state) => ({ ...state, loading: true, failure: null }));
    await this.fetch(next);
  }

  private async fetch(before: number | undefined): Promise<void> {
    const request = ++this.request;
    const action = this.state().action;
    let params = new HttpParams().set('limit', PAGE_SIZE);
    if (before !== undefined) params = params.set('before', before);
    if (action) params = params.set('action', action);
    try {
      const page = await firstValueFrom(this.http.get<AuditPage>('/api/audit', { params }));
      if (request !== this.request) return;
      this.state.update((state) => ({
        ...state,
        events: [...state.events, ...page.events],
        next: page.next,
        loading: false,
        loaded: true,
      }));
    } catch (error) {
      if (request !== this.request) return;
      const failure = failureText(error, 'The audit log could not be loaded.');
      this.state.update((state) => ({ ...state, loading: false, failure }));
    }
  }
}
