import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import type { BatchTurn } from '../batch-types';

/**
 * A cure's turns, oldest first: the day it was turned, who turned it and when it was recorded,
 * with the cook's note. One a day at most; recorded from the daily board.
 */
@Component({
  selector: 'app-turn-list',
  imports: [MatIcon, IsoDayPipe],
  template: `
    <h3 id="turns-title">Turns</h3>
    <ol class="turns" aria-labelledby="turns-title" data-testid="turns">
      @for (turn of turns(); track turn.on) {
        <li class="turn" data-testid="turn">
          <mat-icon aria-hidden="true">autorenew</mat-icon>
          <div>
            <p class="day">Turned {{ turn.on | isoDay }}</p>
            <p class="meta">
              {{ turn.by.displayName }} · recorded
              <time [attr.datetime]="turn.at">{{ turn.at | isoDay: true }}</time>
            </p>
            @if (turn.note) {
              <p class="note">Note: {{ turn.note }}</p>
            }
          </div>
        </li>
      } @empty {
        <li class="none">Not turned yet.</li>
      }
    </ol>
  `,
  styles: `
    h3 {
      margin: 16px 0 8px;
      font: var(--mat-sys-title-medium);
    }
    .turns {
      list-style: none;
      margin: 0;
      padding: 0;
    }
    .turn {
      display: grid;
      grid-template-columns: 24px 1fr;
      gap: 12px;
      padding-bottom: 12px;
    }
    .turn mat-icon {
      color: var(--mat-sys-primary);
    }
    p {
      margin: 0;
    }
    .day {
      font: var(--mat-sys-title-small);
    }
    .meta,
    .none {
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
    }
    .note {
      margin-top: 4px;
      font: var(--mat-sys-body-medium);
      overflow-wrap: anywhere;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TurnList {
  /** The batch's turns, oldest first. */
  readonly turns = input.required<readonly BatchTurn[]>();
}
