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

/** What the sign-off dialog is opened with. */
export interface SignOffDialogData {
  readonly lotCode: string;
  /** Whether signing off holds the batch where it is: only an admin, saying why, moves it on. */
  readonly locks: boolean;
  /** What is not plainly good about the batch ("the check “Fat” failed"); null when nothing. */
  readonly concern: string | null;
}

/** What the sign-off dialog closes with when confirmed. */
export interface SignOff {
  /** The reviewer's note; empty for none. */
  readonly note: string;
}

/**
 * Confirms a reviewer's sign-off, with a note; a batch is signed off once. A batch with a failed
 * check, or still curing, says so and needs the note (the server asks for it too).
 */
@Component({
  selector: 'app-sign-off-dialog',
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
    <h2 mat-dialog-title>Sign off batch {{ data.lotCode }}</h2>
    <form [formGroup]="form" (ngSubmit)="signOff()" data-testid="sign-off-dialog">
      <mat-dialog-content>
        <p>
          You confirm you have reviewed this batch's record: its amounts, limit checks and status
          history. A batch is signed off once, and the sign-off is kept with your name.
        </p>
        @if (data.concern; as concern) {
          <p class="concern" data-testid="sign-off-concern">
            <strong>You are signing off a batch where {{ concern }}.</strong> Say in the note what
            you checked about it; the note is kept with your sign-off.
          </p>
        }
        @if (data.locks) {
          <p data-testid="sign-off-locks">
            It is not finished yet: once you sign it off, only an admin can move it on or discard
            it, and must say why.
          </p>
        }
        <mat-form-field class="note">
          <mat-label>{{ data.concern ? 'Note' : 'Note (optional)' }}</mat-label>
          <textarea
            matInput
            formControlName="note"
            rows="3"
            maxlength="500"
            [required]="!!data.concern"
            cdkFocusInitial
            data-testid="sign-off-note"
          ></textarea>
          <mat-hint>{{ hint }}</mat-hint>
          @if (form.controls.note.hasError('required') || form.controls.note.hasError('pattern')) {
            <mat-error>Say what you checked: {{ data.concern }}.</mat-error>
          }
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button matButton type="button" mat-dialog-close data-testid="sign-off-cancel">
          Cancel
        </button>
        <button matButton="filled" type="submit" data-testid="sign-off-confirm">Sign off</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .note {
      width: 100%;
    }
    .concern {
      border-left: 4px solid var(--mat-sys-error);
      padding-left: 12px;
    }
    button {
      min-height: 48px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignOffDialog {
  private readonly dialog = inject<MatDialogRef<SignOffDialog, SignOff>>(MatDialogRef);
  protected readonly data = inject<SignOffDialogData>(MAT_DIALOG_DATA);
  protected readonly form = inject(NonNullableFormBuilder).group({
    note: [
      '',
      this.data.concern
        ? [Validators.required, Validators.maxLength(500), Validators.pattern(/\S/)]
        : Validators.maxLength(500),
    ],
  });
  protected readonly hint = this.data.concern
    ? 'For example: weights checked against the scale print-out; kept cold until ready'
    : 'For example: probe reading checked, 2 °C';

  protected signOff(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.dialog.close({ note: this.form.getRawValue().note.trim() });
  }
}
