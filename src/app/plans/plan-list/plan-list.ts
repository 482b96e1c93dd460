import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import { paramsOfPlan } from '../plan-query';
import type { PlanListItem } from '../plan-types';

/**
 * The plans made, newest first: the menu item, how many, the day of service, who worked it out
 * and when, and whether its batches were recorded (by whom, how many). Each opens the plan again.
 */
@Component({
  selector: 'app-plan-list',
  imports: [RouterLink, MatIcon, IsoDayPipe],
  templateUrl: './plan-list.html',
  styleUrl: './plan-list.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlanList {
  /** The plans, newest first; null while they load. */
  readonly plans = input.required<readonly PlanListItem[] | null>();
  /** Why the plans could not be read, or null. */
  readonly error = input<string | null>(null);

  /** The address of a plan on this page. */
  protected paramsOf(plan: PlanListItem): Record<string, string | null> {
    return paramsOfPlan({
      assembly: plan.assembly.id,
      count: plan.count,
      for: plan.serviceDate,
      units: 'metric',
    });
  }
}
