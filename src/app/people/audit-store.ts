import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { AuditAction, AuditEvent, AuditPage } from './audit-event';
import { OlderPages } from './older-pages';

/** How many entries one page of the log holds. */
const PAGE_SIZE = 50;

/** What the log is narrowed to; every field is optional. */
export interface AuditFilter {
  readonly action?: AuditAction;
  /** The username of who did it. */
  readonly actor?: string;
  /** What it was done to: a lot code, a formula id, a username. */
  readonly subject?: string;
  /** From this day (yyyy-mm-dd, the browser's days), inclusive. */
  readonly fromDay?: string;
  /** To this day (yyyy-mm-dd), inclusive. */
  readonly toDay?: string;
}

/** The start of a day on this browser's clock, as an instant: "2026-12-03" → ISO 8601 UTC. */
function startOfDay(day: string, plusDays = 0): string {
  const [year, month, date] = day.split('-').map(Number);
  return new Date(year, month - 1, date + plusDays).toISOString();
}

/** The audit log for admins: newest first, a page at a time, narrowed by the filter. */
@Injectable({ providedIn: 'root' })
export class AuditStore {
  private readonly http = inject(HttpClient);
  private readonly filterState = signal<AuditFilter>({});
  private readonly pages = new OlderPages<AuditEvent>(
    (before) => this.fetchPage(before),
    'The audit log could not be loaded.',
  );

  /** The entries fetched so far, newest first. */
  readonly events = this.pages.items;
  /** The filter the entries were fetched with. */
  readonly filter = this.filterState.asReadonly();
  /** Whether there are older entries to fetch. */
  readonly hasMore = this.pages.hasMore;
  /** Whether a page is being fetched. */
  readonly loading = this.pages.loading;
  /** Why the last page could not be fetched, or null. */
  readonly failure = this.pages.failure;
  /** Whether the first page has come back. */
  readonly loaded = this.pages.loaded;

  /** Fetches the newest page for a filter (the last one by default); failures go in `failure`. */
  async load(filter: AuditFilter = this.filterState()): Promise<void> {
    this.filterState.set(filter);
    await this.pages.load();
  }

  /** Fetches the page of older entries after the last one shown. */
  async loadMore(): Promise<void> {
    await this.pages.loadMore();
  }

  private async fetchPage(before: number | undefined) {
    const { action, actor, subject, fromDay, toDay } = this.filterState();
    let params = new HttpParams().set('limit', PAGE_SIZE);
    if (before !== undefined) params = params.set('before', before);
    if (action) params = params.set('action', action);
    if (actor) params = params.set('actor', actor);
    if (subject) params = params.set('subject', subject);
    if (fromDay) params = params.set('from', startOfDay(fromDay));
    if (toDay) params = params.set('to', startOfDay(toDay, 1));
    const page = await firstValueFrom(this.http.get<AuditPage>('/api/audit', { params }));
    return { items: page.events, next: page.next };
  }
}
