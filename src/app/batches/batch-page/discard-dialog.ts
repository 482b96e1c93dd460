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
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';

/** What the discard dialog is opened with. */
export interface DiscardDialogData {
  readonly lotCode: string;
}

/**
 * Asks why a batch is being discarded; closes with the reason, or with nothing when cancelled.
 * A discarded batch stays in the log with its reason, for the record.
 */
@Component({
  selector: 'app-discard-dialog',
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
    MatInput,
    MatButton,
  ],
  template: `
    <h2 mat-dialog-title>Discard batch {{ data.lotCode }}?</h2>
    <form [formGroup]="form" (ngSubmit)="discard()" data-testid="discard-dialog">
      <mat-dialog-content>
        <p>
          A discarded batch stays in the log with your reason and cannot be moved on again. Say why,
          for the record.
        </p>
        <mat-form-field class="reason">
          <mat-label>Reason</mat-label>
          <textarea
            matInput
            formControlName="reason"
            rows="3"
            maxlength="500"
            required
            cdkFocusInitial
            data-testid="discard-reason"
          ></textarea>
          <mat-hint>For example: dropped on the floor; cooler failed overnight</mat-hint>
          @if (form.controls.reason.hasError('required')) {
            <mat-error>Say why the batch is discarded.</mat-error>
          }
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button matButton type="button" mat-dialog-close data-testid="discard-cancel">
          Keep the batch
        </button>
        <button matButton="filled" type="submit" class="danger" data-testid="discard-confirm">
          Discard
        </button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .reason {
      width: 100%;
    }
    button {
      min-height: 48px;
    }
    .danger {
      --mat-button-filled-container-color: var(--mat-sys-error);
      --mat-button-filled-label-text-color: var(--mat-sys-on-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DiscardDialog {
  private readonly dialog = inject<MatDialogRef<DiscardDialog, string>>(MatDialogRef);
  protected readonly data = inject<DiscardDialogData>(MAT_DIALOG_DATA);
  protected readonly form = inject(NonNullableFormBuilder).group({
    reason: ['', [Validators.required, Validators.maxLength(500), Validators.pattern(/\S/)]],
  });

  protected discard(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.dialog.close(this.form.getRawValue().reason.trim());
  }
}
