import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialog,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogRef,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatRadioButton, MatRadioGroup } from '@angular/material/radio';
import { firstValueFrom } from 'rxjs';
import { UnitsTogetherPipe } from '../../ui/units-together';
import type { ActionRequest, ProcessStore } from './process-store';
import type { Deviation, Disposition, ProcessRecord } from './process-types';
import { DISPOSITION_WORDS } from './process-words';

/** What the corrective action dialog is opened with. */
export interface ActionDialogData {
  /** What was missed, in words. */
  readonly what: string;
  /** The control's default corrective action, offered as a suggestion; null for none. */
  readonly suggestion: string | null;
  /** Whether an earlier action is being replaced (a reason is then asked). */
  readonly replacing: boolean;
}

const REQUIRED = [Validators.required, Validators.maxLength(1000), Validators.pattern(/\S/)];

/**
 * The corrective action for a missed critical limit, with the four things a HACCP record needs
 * (9 CFR 417.3(a)): the cause, how the CCP is under control again, what prevents it happening
 * again, and what happened to the product and how much. Closes with the action, or nothing.
 */
@Component({
  selector: 'app-corrective-action-dialog',
  imports: [
    UnitsTogetherPipe,
    ReactiveFormsModule,
    MatDialogTitle,
    MatDialogContent,
    MatDialogActions,
    MatDialogClose,
    MatFormField,
    MatLabel,
    MatHint,
    MatError,
    MatSuffix,
    MatInput,
    MatRadioGroup,
    MatRadioButton,
    MatButton,
  ],
  templateUrl: './corrective-action-dialog.html',
  styleUrl: './corrective-action-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CorrectiveActionDialog {
  private readonly dialog =
    inject<MatDialogRef<CorrectiveActionDialog, ActionRequest>>(MatDialogRef);
  protected readonly data = inject<ActionDialogData>(MAT_DIALOG_DATA);
  // Not affected is the server's alone: it closes a deadline the readings later showed was met.
  protected readonly dispositions = (
    Object.entries(DISPOSITION_WORDS) as [Disposition, string][]
  ).filter(([disposition]) => disposition !== 'unaffected');
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly form = this.fb.group({
    cause: ['', REQUIRED],
    restored: [this.data.suggestion ?? '', REQUIRED],
    prevention: ['', REQUIRED],
    disposition: this.fb.control<Disposition | null>(null, Validators.required),
    weight: ['', Validators.pattern(/^\s*\d+(?:[.,]\d+)?\s*(kg|g|lb|oz)?\s*$/)],
    reason: ['', this.data.replacing ? REQUIRED : []],
  });

  protected confirm(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const raw = this.form.getRawValue();
    const weight = raw.weight.trim().replace(',', '.');
    this.dialog.close({
      cause: raw.cause.trim(),
      restored: raw.restored.trim(),
      prevention: raw.prevention.trim(),
      disposition: raw.disposition as Disposition,
      ...(weight ? { grams: /[a-z]$/.test(weight) ? weight : `${weight} kg` } : {}),
      ...(this.data.replacing ? { reason: raw.reason.trim() } : {}),
    });
  }
}

/**
 * Asks for the corrective action of a deviation and records it.
 * @returns the server's words when it was not recorded; null when recorded or cancelled
 */
export async function recordCorrectiveAction(
  dialog: MatDialog,
  store: ProcessStore,
  deviation: Deviation,
  record: ProcessRecord | null,
): Promise<string | null> {
  const control = record?.controls.find((c) => c.control.id === deviation.control)?.control;
  const ref = dialog.open<CorrectiveActionDialog, ActionDialogData, ActionRequest>(
    CorrectiveActionDialog,
    {
      data: {
        what: deviation.what,
        suggestion: control?.ifMissed ?? null,
        replacing: deviation.action !== null,
      },
      width: '640px',
      maxWidth: '95vw',
      autoFocus: 'first-tabbable',
    },
  );
  const action = await firstValueFrom(ref.afterClosed());
  if (!action) return null;
  const outcome = await store.act(deviation.id, action);
  return outcome.ok ? null : outcome.message;
}
