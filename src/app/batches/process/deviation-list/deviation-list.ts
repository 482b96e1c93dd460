import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { UnitsTogetherPipe } from '../../../ui/units-together';
import { recordCorrectiveAction } from '../corrective-action-dialog';
import { ProcessStore } from '../process-store';
import type { Deviation } from '../process-types';
import { DISPOSITION_WORDS, clockWords, weightWords } from '../process-words';

/**
 * Every deviation of the batch, open ones first: what was missed and when, and for a closed one
 * its corrective action with the four things and who recorded it. A batch that ever had one is
 * kept as nonconforming, with what happened to the product.
 */
@Component({
  selector: 'app-deviation-list',
  imports: [MatButton, MatIcon, UnitsTogetherPipe],
  templateUrl: './deviation-list.html',
  styleUrl: './deviation-list.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DeviationList {
  private readonly dialog = inject(MatDialog);
  protected readonly store = inject(ProcessStore);

  /** Whether the signed-in person records corrective actions. */
  readonly canAct = input(false);

  protected readonly dispositionWords = DISPOSITION_WORDS;
  protected readonly deviations = computed(() =>
    [...(this.store.record()?.deviations ?? [])].sort(
      (a, b) => Number(a.action !== null) - Number(b.action !== null) || b.id - a.id,
    ),
  );
  protected readonly problem = signal<string | null>(null);

  protected when(iso: string): string {
    return clockWords(iso);
  }

  protected weight(grams: string): string {
    return weightWords(grams);
  }

  protected async act(deviation: Deviation): Promise<void> {
    this.problem.set(
      await recordCorrectiveAction(this.dialog, this.store, deviation, this.store.record()),
    );
  }
}
