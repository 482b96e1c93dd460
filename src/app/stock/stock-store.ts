import { HttpClient } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type {
  Receipt,
  ReceiptPage,
  ReceiptRequest,
  ReceivingItem,
  StockView,
} from '../../../shared/api/receipt.ts';
import { messageOf } from '../core/api/message-of';

export type {
  Receipt,
  ReceiptRequest,
  ReceivingItem,
  StockItemView,
  StockLotView,
  StockView,
} from '../../../shared/api/receipt.ts';

/**
 * Deliveries and stock over /api/receipts and /api/stock: the catalogue's items with their
 * receiving limits, what is on hand first to expire first, and the latest deliveries.
 */
@Injectable({ providedIn: 'root' })
export class StockStore {
  private readonly http = inject(HttpClient);
  readonly items = signal<readonly ReceivingItem[]>([]);
  readonly stock = signal<StockView | null>(null);
  readonly recent = signal<readonly Receipt[]>([]);
  readonly loading = signal(false);
  readonly error = signal<string | null>(null);

  /** Reads items, stock and the latest deliveries; a failure is kept in `error`. */
  async load(): Promise<void> {
    this.loading.set(true);
    this.error.set(null);
    try {
      const [items, stock, recent] = await Promise.all([
        firstValueFrom(this.http.get<{ items: ReceivingItem[] }>('/api/stock/items')),
        firstValueFrom(this.http.get<StockView>('/api/stock')),
        firstValueFrom(this.http.get<ReceiptPage>('/api/receipts', { params: { pageSize: 10 } })),
      ]);
      this.items.set(items.items);
      this.stock.set(stock);
      this.recent.set(recent.receipts);
    } catch (error) {
      this.error.set(messageOf(error));
    } finally {
      this.loading.set(false);
    }
  }

  /** Receives a delivery; throws the API's error (over its limit with no decision, a field missing). */
  async receive(request: ReceiptRequest): Promise<Receipt> {
    const answer = await firstValueFrom(
      this.http.post<{ receipt: Receipt }>('/api/receipts', request),
    );
    void this.load();
    return answer.receipt;
  }

  /** Discards what is left of a lot, with the reason; throws the API's error. */
  async discard(lot: string, reason: string): Promise<void> {
    await firstValueFrom(this.http.post(`/api/receipts/${lot}/discard`, { reason }));
    void this.load();
  }
}
