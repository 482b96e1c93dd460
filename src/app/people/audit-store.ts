import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { AuditAction, AuditEvent, AuditPage } from './audit-event';
import { OlderPages } from './older-pages';

/** How many entries one page of the log holds. */
const PAGE_SIZE = 50;

/** The audit log for admins: newest first, a page at a time, optionally one action only. */
@Injectable({ providedIn: 'root' })
export class AuditStore {
  private readonly http = inject(HttpClient);
  private readonly actionState = signal<AuditAction | null>(null);
  private readonly pages = new OlderPages<AuditEvent>(
    (before) => this.fetchPage(before),
    'The audit log could not be loaded.',
  );

  /** The entries fetched so far, newest first. */
  readonly events = this.pages.items;
  /** The action filter, or null for all actions. */
  readonly action = this.actionState.asReadonly();
  /** Whether there are older entries to fetch. */
  readonly hasMore = this.pages.hasMore;
  /** Whether a page is being fetched. */
  readonly loading = this.pages.loading;
  /** Why the last page could not be fetched, or null. */
  readonly failure = this.pages.failure;
  /** Whether the first page has come back. */
  readonly loaded = this.pages.loaded;

  /** Fetches the newest page, for all actions or for one; failures are kept in `failure`. */
  async load(action: AuditAction | null = this.actionState()): Promise<void> {
    this.actionState.set(action);
    await this.pages.load();
  }

  /** Fetches the page of older entries after the last one shown. */
  async loadMore(): Promise<void> {
    await this.pages.loadMore();
  }

  private async fetchPage(before: number | undefined) {
    const action = this.actionState();
    let params = new HttpParams().set('limit', PAGE_SIZE);
    if (before !== undefined) params = params.set('before', before);
    if (action) params = params.set('action', action);
    const page = await firstValueFrom(this.http.get<AuditPage>('/api/audit', { params }));
    return { items: page.events, next: page.next };
  }
}
