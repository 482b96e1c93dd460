import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
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
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';

/** What the correction dialog is opened with: the entry and its value in words. */
export interface CorrectionDialogData {
  /** "Chilling after the smoke, 14:02" or "Curing salt". */
  readonly what: string;
  /** The value as it stands: "26.7 °C". */
  readonly old: string;
  /** The unit a bare number is taken in. */
  readonly unit: string;
}

/** What the correction dialog closes with. */
export interface Correction {
  readonly value: string;
  readonly reason: string;
}

/**
 * Asks for the corrected value and why: a reading or a weight is never changed in place, the
 * correction is a new entry kept beside the old one with the reason.
 */
@Component({
  selector: 'app-correction-dialog',
  imports: [
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
    MatButton,
  ],
  template: `
    <h2 mat-dialog-title>Correct {{ data.what }}</h2>
    <form [formGroup]="form" (ngSubmit)="confirm()" data-testid="correction-dialog">
      <mat-dialog-content>
        <p>
          It stands at <strong>{{ data.old }}</strong>. The old value stays on the record, struck
          through, with your reason.
        </p>
        <mat-form-field class="wide">
          <mat-label>Correct value</mat-label>
          <input
            matInput
            formControlName="value"
            inputmode="decimal"
            autocomplete="off"
            cdkFocusInitial
            data-testid="correction-value"
          />
          <span matTextSuffix>{{ data.unit }}</span>
          @if (form.controls.value.hasError('required')) {
            <mat-error>Enter the correct value.</mat-error>
          }
        </mat-form-field>
        <mat-form-field class="wide">
          <mat-label>Why it is corrected</mat-label>
          <textarea
            matInput
            formControlName="reason"
            rows="2"
            maxlength="500"
            data-testid="correction-reason"
          ></textarea>
          <mat-hint>For example: probe read in the wrong piece; typed 62 for 26</mat-hint>
          @if (form.controls.reason.hasError('required')) {
            <mat-error>Say why it is corrected.</mat-error>
          }
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button matButton type="button" mat-dialog-close>Cancel</button>
        <button matButton="filled" type="submit" data-testid="correction-confirm">
          Save the correction
        </button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .wide {
      width: 100%;
    }
    input {
      font-size: 1.5rem;
    }
    button {
      min-height: 48px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CorrectionDialog {
  private readonly dialog = inject<MatDialogRef<CorrectionDialog, Correction>>(MatDialogRef);
  protected readonly data = inject<CorrectionDialogData>(MAT_DIALOG_DATA);
  protected readonly form = inject(NonNullableFormBuilder).group({
    value: ['', [Validators.required, Validators.pattern(/\S/)]],
    reason: ['', [Validators.required, Validators.maxLength(500), Validators.pattern(/\S/)]],
  });

  protected confirm(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { value, reason } = this.form.getRawValue();
    this.dialog.close({ value: value.trim(), reason: reason.trim() });
  }
}
