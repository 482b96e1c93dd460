import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { SessionStore } from '../../core/auth/session-store';
import { latestRead } from '../../ui/latest-read';
import { LoadState } from '../../ui/load-state/load-state';
import { CostApi } from '../cost-api';
import { costSourceWords, unpricedWords } from '../cost-words';

/**
 * A batch's cost on its page, for admins and reviewers only (cooks see nothing of it): the whole
 * batch, per finished kilogram and per portion, what was priced at a latest price for want of a
 * lot, what has no price, and every line with where its price came from.
 */
@Component({
  selector: 'app-batch-cost',
  imports: [LoadState],
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
  protected readonly cost = latestRead(
    () => (this.shown() ? this.lot() : null),
    (lot: string) => this.api.batchCost(lot),
  );
  protected readonly unpriced = computed(() => unpricedWords(this.cost.value()?.unpriced ?? []));
  protected readonly sourceWords = costSourceWords;
}
