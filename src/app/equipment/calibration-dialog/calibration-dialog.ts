import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogRef,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatRadioButton, MatRadioGroup } from '@angular/material/radio';
import { icePointCheck } from '../../../../shared/process/ice-point.ts';
import { messageOf } from '../../core/api/message-of';
import { EquipmentStore } from '../equipment-store';
import type { CalibrationOutcome, Equipment } from '../equipment-types';
import {
  TemperatureEntry,
  temperatureForm,
  temperatureText,
} from '../temperature-entry/temperature-entry';

/**
 * A thermometer's ice-point check: what it reads in a slurry of ice and water, and what was done.
 * Outside the tolerance it cannot be passed as it is: adjusted or retired (the server says so too).
 */
@Component({
  selector: 'app-calibration-dialog',
  imports: [
    ReactiveFormsModule,
    MatDialogTitle,
    MatDialogContent,
    MatDialogActions,
    MatDialogClose,
    MatFormField,
    MatLabel,
    MatInput,
    MatButton,
    MatRadioGroup,
    MatRadioButton,
    MatIcon,
    MatProgressBar,
    TemperatureEntry,
  ],
  templateUrl: './calibration-dialog.html',
  styleUrl: '../equipment-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CalibrationDialog {
  protected readonly equipment = inject<Equipment>(MAT_DIALOG_DATA);
  private readonly store = inject(EquipmentStore);
  private readonly dialogRef = inject(MatDialogRef<CalibrationDialog>);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly form = this.fb.group({
    reading: temperatureForm(this.fb),
    outcome: ['ok' as CalibrationOutcome],
    note: ['', Validators.maxLength(500)],
  });
  private readonly values = toSignal(this.form.controls.reading.valueChanges, {
    initialValue: this.form.controls.reading.value,
  });
  /** What the reading says against the ice point, as it is typed; null until it is a number. */
  protected readonly check = computed(() => {
    const { value, unit } = this.values();
    const text = temperatureText(value ?? '', unit ?? '°C');
    if (!text) return null;
    try {
      return icePointCheck(text);
    } catch {
      return null;
    }
  });
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected async save(): Promise<void> {
    const check = this.check();
    const { reading: entry, outcome, note } = this.form.getRawValue();
    const reading = temperatureText(entry.value, entry.unit);
    if (this.form.invalid || !reading || this.busy()) {
      this.form.markAllAsTouched();
      return;
    }
    if (check && !check.passes && outcome === 'ok') {
      this.failure.set('It is off the ice point by more than is allowed: adjust it or retire it.');
      return;
    }
    this.busy.set(true);
    this.failure.set(null);
    try {
      await this.store.calibrate(this.equipment.id, {
        reading,
        outcome,
        ...(note.trim() ? { note: note.trim() } : {}),
      });
      this.dialogRef.close(true);
    } catch (error) {
      this.failure.set(messageOf(error));
    } finally {
      this.busy.set(false);
    }
  }
}
