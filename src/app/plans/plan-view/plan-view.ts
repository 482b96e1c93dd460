import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { BatchSheet } from '../../ui/batch-sheet/batch-sheet';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import { DoughWater } from '../dough-water/dough-water';
import {
  hasPreferment,
  isWaterWarning,
  needsDoughTemperatures,
} from '../dough-water/dough-water-need';
import { PlanSchedule } from '../plan-schedule/plan-schedule';
import { plainNote, whenInWords } from '../plan-words';
import type { PlanStock, PresentedPlan } from '../plan-types';
import { PlanStockView } from '../plan-stock/plan-stock';

/**
 * A plan as the kitchen works from it: the allergens of the whole menu item first, the warnings,
 * the schedule day by day, the cautions (always shown: they are about food safety), then every
 * batch with what it is for, its quantities and its batch sheet, and the pull list added up over
 * every batch, and that pull list against the lots on hand. Presentational only.
 */
@Component({
  selector: 'app-plan-view',
  imports: [RouterLink, MatIcon, IsoDayPipe, BatchSheet, PlanSchedule, DoughWater, PlanStockView],
  templateUrl: './plan-view.html',
  styleUrl: './plan-view.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlanView {
  /** The plan, as the API presents it, with its pull list against stock when the API sent it. */
  readonly plan = input.required<PresentedPlan & { readonly stock?: PlanStock }>();

  /** The allergens as the law words them, kinds named: "milk, fish (anchovy)". */
  protected readonly allergens = computed(() => this.plan().allergens);
  protected readonly dayCount = computed(
    () => new Set(this.plan().batches.map((batch) => batch.start)).size,
  );
  protected readonly unitWords = computed(() =>
    this.plan().units === 'us' ? 'US units' : 'metric units',
  );
  /** Whether any material is pulled before trimming (a trim yield): its column is shown. */
  protected readonly beforeTrim = computed(() =>
    this.plan().pullList.some((item) => item.beforeTrim !== undefined),
  );
  /** Formula titles by id. */
  protected readonly titles = computed(
    () => new Map(this.plan().batches.map((batch) => [batch.formula.id, batch.formula.title])),
  );

  protected readonly whenInWords = whenInWords;
  protected readonly plainNote = plainNote;
  protected readonly hasPreferment = hasPreferment;
  /** The doughs whose water temperature waits for the day's temperatures: their warning has boxes. */
  protected readonly doughs = computed(() => this.plan().batches.filter(needsDoughTemperatures));
  /** The plan's warnings but those the doughs' boxes answer. */
  protected readonly otherWarnings = computed(() =>
    this.plan().warnings.filter(
      (warning) => !this.doughs().some((dough) => isWaterWarning(warning, dough.formula.title)),
    ),
  );

  /** The batches that use a material, by title. */
  protected usedBy(ids: readonly string[]): string {
    return ids.map((id) => this.titles().get(id) ?? id).join('; ');
  }
}
