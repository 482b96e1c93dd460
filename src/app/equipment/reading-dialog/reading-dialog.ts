import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialog,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { temperatureWords } from '../../../../shared/process/control-words.ts';
import { messageOf } from '../../core/api/message-of';
import { recordEquipmentAction } from '../equipment-action';
import { EquipmentStore } from '../equipment-store';
import type { Equipment, EquipmentReadingAnswer } from '../equipment-types';
import {
  TemperatureEntry,
  temperatureForm,
  temperatureText,
} from '../temperature-entry/temperature-entry';

/**
 * Records a reading at the unit, on a tablet held in one hand: one big number box, °C or °F,
 * one big button; then says plainly whether it is within the limit or opened a deviation.
 */
@Component({
  selector: 'app-reading-dialog',
  imports: [
    ReactiveFormsModule,
    MatDialogTitle,
    MatDialogContent,
    MatDialogActions,
    MatDialogClose,
    MatButton,
    MatIcon,
    MatProgressBar,
    TemperatureEntry,
  ],
  templateUrl: './reading-dialog.html',
  styleUrl: '../equipment-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReadingDialog {
  protected readonly equipment = inject<Equipment>(MAT_DIALOG_DATA);
  private readonly store = inject(EquipmentStore);
  protected readonly form = temperatureForm(inject(NonNullableFormBuilder));
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly saved = signal<EquipmentReadingAnswer | null>(null);
  protected readonly degrees = temperatureWords;
  private readonly dialog = inject(MatDialog);
  /** Whether the deviation's corrective action has been recorded. */
  protected readonly acted = signal(false);

  protected async act(deviation: { id: number; what: string }): Promise<void> {
    const outcome = await recordEquipmentAction(this.dialog, this.store, deviation);
    this.acted.set(outcome.recorded);
    this.failure.set(outcome.failure);
  }

  protected async save(): Promise<void> {
    const { value, unit } = this.form.getRawValue();
    const text = temperatureText(value, unit);
    if (!text || this.busy()) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.failure.set(null);
    try {
      this.saved.set(await this.store.record(this.equipment.id, { value: text }));
    } catch (error) {
      this.failure.set(messageOf(error));
    } finally {
      this.busy.set(false);
    }
  }
}
