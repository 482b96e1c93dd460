import { ChangeDetectionStrategy, Component, OnInit, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialog,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatFormField, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { temperatureWords } from '../../../../shared/process/control-words.ts';
import { messageOf } from '../../core/api/message-of';
import { DAY_INPUT_IMPORTS, provideDayInputs } from '../../ui/batch-sheet/day-input-formats';
import { IsoDayPipe, isoDateOf } from '../../ui/batch-sheet/iso-day-pipe';
import { recordEquipmentAction } from '../equipment-action';
import { EquipmentStore } from '../equipment-store';
import type { Equipment, EquipmentLog } from '../equipment-types';

const WEEK_MS = 7 * 86_400_000;

/** A period's log of one piece: its readings, the deviations they opened and its checks. */
@Component({
  selector: 'app-equipment-log-dialog',
  imports: [
    IsoDayPipe,
    ReactiveFormsModule,
    MatDialogTitle,
    MatDialogContent,
    MatDialogActions,
    MatDialogClose,
    MatFormField,
    MatLabel,
    MatSuffix,
    MatInput,
    DAY_INPUT_IMPORTS,
    MatButton,
    MatProgressBar,
  ],
  providers: [provideDayInputs()],
  templateUrl: './equipment-log-dialog.html',
  styleUrl: '../equipment-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EquipmentLogDialog implements OnInit {
  protected readonly equipment = inject<Equipment>(MAT_DIALOG_DATA);
  private readonly store = inject(EquipmentStore);
  protected readonly form = inject(NonNullableFormBuilder).group({
    from: [new Date(Date.now() - WEEK_MS) as Date | null, Validators.required],
    to: [new Date() as Date | null, Validators.required],
  });
  protected readonly log = signal<EquipmentLog | null>(null);
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly degrees = temperatureWords;
  private readonly dialog = inject(MatDialog);

  protected async act(deviation: { id: number; what: string }): Promise<void> {
    const outcome = await recordEquipmentAction(this.dialog, this.store, deviation);
    this.failure.set(outcome.failure);
    if (outcome.recorded) await this.show();
  }

  ngOnInit(): void {
    void this.show();
  }

  protected async show(): Promise<void> {
    if (this.form.invalid) return;
    const from = isoDateOf(this.form.controls.from.value);
    const to = isoDateOf(this.form.controls.to.value);
    if (!from || !to) return;
    this.busy.set(true);
    this.failure.set(null);
    try {
      this.log.set(await this.store.log(this.equipment.id, from, to));
    } catch (error) {
      this.failure.set(messageOf(error));
    } finally {
      this.busy.set(false);
    }
  }
}
