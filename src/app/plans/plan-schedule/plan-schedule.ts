import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import { beforeServiceWords, scheduleOf } from '../plan-schedule-days';
import type { PresentedPlan } from '../plan-types';

/**
 * A plan day by day: each start day, how long before service it is, and the batches that start
 * on it with what each is for and when it is ready. With `linkBatches`, each batch links to its
 * section of the page (#plan-batch-ID).
 */
@Component({
  selector: 'app-plan-schedule',
  imports: [IsoDayPipe],
  templateUrl: './plan-schedule.html',
  styleUrl: './plan-schedule.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlanSchedule {
  /** The plan. */
  readonly plan = input.required<PresentedPlan>();
  /** Whether each batch links to its own section further down the page. */
  readonly linkBatches = input(false);
  /** The heading level of each day. */
  readonly level = input(3);

  protected readonly days = computed(() =>
    scheduleOf(this.plan()).map((day) => ({ ...day, when: beforeServiceWords(day.beforeService) })),
  );
}
