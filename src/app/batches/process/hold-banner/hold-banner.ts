import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { UnitsTogetherPipe } from '../../../ui/units-together';
import { recordCorrectiveAction } from '../corrective-action-dialog';
import { ProcessStore } from '../process-store';
import type { Deviation } from '../process-types';
import { clockWords } from '../process-words';

/**
 * The hold at the top of a batch page: each open deviation, what was missed and when, and a
 * button to record its corrective action. A batch on hold cannot be marked done or released.
 */
@Component({
  selector: 'app-hold-banner',
  imports: [MatButton, MatIcon, UnitsTogetherPipe],
  template: `
    @if (open().length) {
      <section class="hold" role="alert" aria-labelledby="hold-title" data-testid="hold-banner">
        <h2 id="hold-title">
          <mat-icon aria-hidden="true">front_hand</mat-icon>
          On hold: {{ open().length === 1 ? 'a critical limit was' : 'critical limits were' }}
          missed
        </h2>
        <p class="lead">
          Keep the product apart. It cannot be marked done or released until each deviation has its
          corrective action.
        </p>
        <ul>
          @for (deviation of open(); track deviation.id) {
            <li data-testid="hold-deviation">
              <div>
                <strong>{{ deviation.what | unitsTogether }}</strong>
                <span class="when">Opened {{ when(deviation.openedAt) }}</span>
              </div>
              @if (canAct()) {
                <button
                  matButton="filled"
                  type="button"
                  [disabled]="store.writing()"
                  (click)="act(deviation)"
                  data-testid="record-action"
                >
                  Record corrective action
                </button>
              }
            </li>
          }
        </ul>
        @if (problem(); as message) {
          <p class="problem" data-testid="action-problem">{{ message }}</p>
        }
      </section>
    }
  `,
  styleUrl: './hold-banner.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HoldBanner {
  private readonly dialog = inject(MatDialog);
  protected readonly store = inject(ProcessStore);

  /** Whether the signed-in person records corrective actions. */
  readonly canAct = input(false);

  protected readonly open = computed(
    () => this.store.record()?.deviations.filter((d) => d.action === null) ?? [],
  );
  protected readonly problem = signal<string | null>(null);

  protected when(iso: string): string {
    return clockWords(iso);
  }

  protected async act(deviation: Deviation): Promise<void> {
    this.problem.set(
      await recordCorrectiveAction(this.dialog, this.store, deviation, this.store.record()),
    );
  }
}
