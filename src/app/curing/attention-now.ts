import { HttpClient } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { NowItem, ProcessNow } from '../../../shared/api/process-record.ts';
import { messageOf } from '../core/api/message-of';

/**
 * What needs attention now across every batch (GET /api/process/now): readings due, cooling
 * stage deadlines, open deviations, most urgent first as the server orders them.
 */
@Injectable({ providedIn: 'root' })
export class AttentionNow {
  private readonly http = inject(HttpClient);
  private readonly list = signal<readonly NowItem[] | null>(null);
  private readonly failure = signal<string | null>(null);
  private readonly stamp = signal(new Date());

  /** The items, most urgent first; null until read. */
  readonly items = this.list.asReadonly();
  /** Why the list could not be read, or null. */
  readonly error = this.failure.asReadonly();
  /** When it was read: "overdue" is counted from here. */
  readonly readAt = this.stamp.asReadonly();

  /** Reads the list again. */
  async load(): Promise<void> {
    try {
      const { items } = await firstValueFrom(this.http.get<ProcessNow>('/api/process/now'));
      this.list.set(items);
      this.stamp.set(new Date());
      this.failure.set(null);
    } catch (error) {
      this.failure.set(messageOf(error));
    }
  }
}
