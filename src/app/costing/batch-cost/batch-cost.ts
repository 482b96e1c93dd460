import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  signal,
  untracked,
} from '@angular/core';
import { MatProgressBar } from '@angular/material/progress-bar';
import { messageOf } from '../../core/api/message-of';
import { SessionStore } from '../../core/auth/session-store';
import { CostApi, type BatchCostRecord } from '../cost-api';
import { costSourceWords, unpricedWords } from '../cost-words';

/**
 * A batch's cost on its page, for admins and reviewers only (cooks see nothing of it): the whole
 * batch, per finished kilogram and per portion, what was priced at a latest price for want of a
 * lot, what has no price, and every line with where its price came from.
 */
@Component({
  selector: 'app-batch-cost',
  imports: [MatProgressBar],
  templateUrl: './batch-cost.html',
  styleUrl: './batch-cost.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BatchCost {
  private readonly api = inject(CostApi);
  private readonly session = inject(SessionStore);

  /** The batch's lot code. */
  readonly lot = input.required<string>();

  protected readonly shown = computed(() => this.session.hasRole('admin', 'reviewer'));
  protected readonly cost = signal<BatchCostRecord | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly loading = signal(false);
  protected readonly unpriced = computed(() => unpricedWords(this.cost()?.unpriced ?? []));
  protected readonly sourceWords = costSourceWords;
  private request = 0;

  constructor() {
    effect(() => {
      const lot = this.lot();
      if (this.shown()) untracked(() => void this.load(lot));
    });
  }

  private async load(lot: string): Promise<void> {
    const request = ++this.request;
    this.loading.set(true);
    this.error.set(null);
    try {
      const cost = await this.api.batchCost(lot);
      if (request === this.request) this.cost.set(cost);
    } catch (error) {
      if (request === this.request) this.error.set(messageOf(error));
    } finally {
      if (request === this.request) this.loading.set(false);
    }
  }
}
