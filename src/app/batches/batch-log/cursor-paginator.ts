import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatIconButton } from '@angular/material/button';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatOption, MatSelect } from '@angular/material/select';
import { PAGE_SIZES, type PageSize } from './log-query';

/**
 * Previous and next page along the API's keyset cursors, the page size, and where the page sits
 * in the whole ("26–50 of 53"). Keyset pages have no page numbers to jump to.
 */
@Component({
  selector: 'app-cursor-paginator',
  imports: [MatIconButton, MatIcon, MatFormField, MatLabel, MatSelect, MatOption],
  template: `
    <nav class="pager" aria-label="Pages of the batch log">
      <mat-form-field class="size" subscriptSizing="dynamic">
        <mat-label>Batches per page</mat-label>
        <mat-select
          [value]="size()"
          (selectionChange)="sizeChange.emit($event.value)"
          data-testid="page-size"
        >
          @for (choice of sizes; track choice) {
            <mat-option [value]="choice">{{ choice }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <span class="range" data-testid="page-range" aria-live="polite">
        @if (range(); as r) {
          {{ r.first }}–{{ r.last }} of {{ total() }}{{ totalExact() ? '' : '+' }}
        } @else {
          0 of {{ total() }}
        }
      </span>
      <button
        matIconButton
        type="button"
        aria-label="Previous page"
        [disabled]="!hasPrev() || busy()"
        (click)="prev.emit()"
        data-testid="page-prev"
      >
        <mat-icon>chevron_left</mat-icon>
      </button>
      <button
        matIconButton
        type="button"
        aria-label="Next page"
        [disabled]="!hasNext() || busy()"
        (click)="next.emit()"
        data-testid="page-next"
      >
        <mat-icon>chevron_right</mat-icon>
      </button>
    </nav>
  `,
  styles: `
    .pager {
      display: flex;
      align-items: center;
      justify-content: flex-end;
      flex-wrap: wrap;
      gap: 8px 16px;
      padding: 12px 0;
    }
    .size {
      width: 180px;
    }
    .range {
      min-width: 110px;
      text-align: center;
      font: var(--mat-sys-body-large);
      font-variant-numeric: tabular-nums;
    }
    button {
      width: 48px;
      height: 48px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CursorPaginator {
  /** Batches on a page. */
  readonly size = input.required<PageSize>();
  /** Positions of the first and last batch shown, from 1; null when the page is empty. */
  readonly range = input.required<{ first: number; last: number } | null>();
  /** How many batches there are in all, or the most the server counted (see totalExact). */
  readonly total = input.required<number>();
  /** False when there are more than total: the server stops counting there ("1–50 of 1000+"). */
  readonly totalExact = input(true);
  /** Whether there is a page before this one. */
  readonly hasPrev = input.required<boolean>();
  /** Whether there is a page after this one. */
  readonly hasNext = input.required<boolean>();
  /** Whether a page is on its way (the buttons wait). */
  readonly busy = input(false);
  /** The page before was asked for. */
  readonly prev = output<void>();
  /** The page after was asked for. */
  readonly next = output<void>();
  /** Another page size was chosen. */
  readonly sizeChange = output<PageSize>();

  protected readonly sizes = PAGE_SIZES;
}
