import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import type { PlanStock, PresentedAmount, PresentedPullLine, PresentedWeight } from '../plan-types';

/**
 * A plan's pull list against the lots on hand: one card per material, short ones first and
 * marked in words ("Short 107 g") as well as colour, with the morning more must arrive by and
 * the supplier it came from last; what is not compared listed apart with the reason; or why the
 * comparison could not be made. Cards, not a table, so a phone never scrolls sideways.
 * Presentational only.
 */
@Component({
  selector: 'app-plan-stock',
  imports: [MatIcon, IsoDayPipe],
  templateUrl: './plan-stock.html',
  styleUrl: './plan-stock.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlanStockView {
  /** The comparison, as the API sends it with the plan. */
  readonly stock = input.required<PlanStock>();
  /** Formula titles by id, to say which batches use a material. */
  readonly titles = input<ReadonlyMap<string, string>>(new Map());

  /** The lines compared, or none when the comparison could not be made. */
  protected readonly lines = computed(() => {
    const stock = this.stock();
    return stock.compared ? stock.lines : [];
  });
  protected readonly shortCount = computed(
    () => this.lines().filter((line) => line.status === 'short').length,
  );

  /** An amount for the cook: "none" for nothing. */
  protected amount(figure: PresentedWeight | PresentedAmount): string {
    return ('exact' in figure ? figure.exact : figure.grams) === '0' ? 'none' : figure.amount;
  }

  /** The batches that use a material, by title. */
  protected usedBy(line: { readonly usedBy: readonly string[] }): string {
    return line.usedBy.map((id) => this.titles().get(id) ?? id).join('; ');
  }

  protected isShort(line: PresentedPullLine): boolean {
    return line.status === 'short';
  }
}
