import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { RouterLink } from '@angular/router';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import type { BatchSummary } from '../../batches/batch-types';

/**
 * Batches recorded from a plan, each a link to its batch: lot code, formula and start day, and
 * who recorded it when that matters (batches recorded earlier, perhaps by someone else).
 */
@Component({
  selector: 'app-planned-batches',
  imports: [RouterLink, IsoDayPipe],
  template: `
    <ul>
      @for (batch of batches(); track batch.lotCode) {
        <li>
          <a
            class="lot-code"
            [routerLink]="['/batches', batch.lotCode]"
            [attr.data-testid]="linkTestId()"
            >{{ batch.lotCode }}</a
          >
          {{ batch.formula.title }}, starts
          <time [attr.datetime]="batch.startedOn">{{ batch.startedOn | isoDay }}</time>
          @if (withWho()) {
            · {{ batch.operator.displayName }}
          }
        </li>
      }
    </ul>
  `,
  styles: `
    ul {
      margin: 0 0 8px;
      padding-left: 20px;
    }
    li {
      padding: 2px 0;
    }
    a {
      color: var(--mat-sys-primary);
    }
    a:focus-visible {
      outline: 3px solid var(--mat-sys-primary);
      outline-offset: 2px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlannedBatches {
  /** The batches, earliest start first. */
  readonly batches = input.required<readonly BatchSummary[]>();
  /** The test id of each batch's link. */
  readonly linkTestId = input.required<string>();
  /** Whether to say who recorded each batch. */
  readonly withWho = input(false);
}
