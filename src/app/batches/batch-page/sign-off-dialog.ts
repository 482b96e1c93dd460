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
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';

/** What the sign-off dialog is opened with. */
export interface SignOffDialogData {
  readonly lotCode: string;
  /** Whether signing off holds the batch where it is: only an admin, saying why, moves it on. */
  readonly locks: boolean;
}

/** What the sign-off dialog closes with when confirmed. */
export interface SignOff {
  /** The reviewer's note; empty for none. */
  readonly note: string;
}

/** Confirms a reviewer's sign-off, with an optional note; a batch is signed off once. */
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
        @if (data.locks) {
          <p data-testid="sign-off-locks">
            It is not finished yet: once you sign it off, only an admin can move it on or discard
            it, and must say why.
          </p>
        }
        <mat-form-field class="note">
          <mat-label>Note (optional)</mat-label>
          <textarea
            matInput
            formControlName="note"
            rows="3"
            maxlength="500"
            cdkFocusInitial
            data-testid="sign-off-note"
          ></textarea>
          <mat-hint>For example: probe reading checked, 2 °C</mat-hint>
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
    note: ['', Validators.maxLength(500)],
  });

  protected signOff(): void {
    this.dialog.close({ note: this.form.getRawValue().note.trim() });
  }
}
