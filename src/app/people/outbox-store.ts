import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { OlderPages } from './older-pages';
import { OutboxMessage, OutboxPage, OutboxSummary, TransportName } from './outbox-message';

/** How many messages one page of the outbox holds. */
const PAGE_SIZE = 50;

/** The outbox for admins: every message Larderbook has sent or kept, newest first. */
@Injectable({ providedIn: 'root' })
export class OutboxStore {
  private readonly http = inject(HttpClient);
  private readonly transportState = signal<TransportName | null>(null);
  private readonly pages = new OlderPages<OutboxSummary>(
    (before) => this.fetchPage(before),
    'The outbox could not be loaded.',
  );

  /** The messages fetched so far, newest first. */
  readonly messages = this.pages.items;
  /** Whether there are older messages to fetch. */
  readonly hasMore = this.pages.hasMore;
  /** Whether a page is being fetched. */
  readonly loading = this.pages.loading;
  /** Why the last page could not be fetched, or null. */
  readonly failure = this.pages.failure;
  /** Whether the first page has come back. */
  readonly loaded = this.pages.loaded;
  /** Where messages go, as the server said with the last page; null before the first. */
  readonly transport = this.transportState.asReadonly();

  /** Fetches the newest page again; failures are kept in `failure`. */
  load(): Promise<void> {
    return this.pages.load();
  }

  /** Fetches the page of older messages after the last one shown. */
  loadMore(): Promise<void> {
    return this.pages.loadMore();
  }

  /** One message with its text; rejects with an ApiError (404 when there is none). */
  async message(id: number): Promise<OutboxMessage> {
    const { message } = await firstValueFrom(
      this.http.get<{ message: OutboxMessage }>(`/api/outbox/${id}`),
    );
    return message;
  }

  private async fetchPage(before: number | undefined) {
    let params = new HttpParams().set('limit', PAGE_SIZE);
    if (before !== undefined) params = params.set('before', before);
    const page = await firstValueFrom(this.http.get<OutboxPage>('/api/outbox', { params }));
    this.transportState.set(page.transport);
    return { items: page.messages, next: page.next };
  }
}
