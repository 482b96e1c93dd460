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
import type { BatchStatus } from '../batch-types';

/** What the reason dialog is opened with: the batch, and the move that needs a reason. */
export interface ReasonDialogData {
  readonly lotCode: string;
  readonly to: BatchStatus;
  /** The move's button words, for the confirm button: "Mark done". */
  readonly action: string;
}

/** The dialog's words: discarding any batch, or moving one already signed off. */
interface ReasonWords {
  /** The title before the lot code: "Discard batch". */
  readonly title: string;
  readonly lead: string;
  readonly hint: string;
  readonly missing: string;
  readonly keep: string;
  readonly confirm: string;
}

function wordsFor(data: ReasonDialogData): ReasonWords {
  if (data.to === 'discarded')
    return {
      title: 'Discard batch',
      lead: 'A discarded batch stays in the log with your reason and cannot be moved on again. Say why, for the record.',
      hint: 'For example: dropped on the floor; cooler failed overnight',
      missing: 'Say why the batch is discarded.',
      keep: 'Keep the batch',
      confirm: 'Discard',
    };
  return {
    title: 'Move signed-off batch',
    lead: 'This batch is signed off, so its record was reviewed as it stands. Say why its status changes now: the reason is kept with the change for the reviewer to see.',
    hint: 'For example: signed off while curing; the probe reading came in after',
    missing: 'Say why the status changes.',
    keep: 'Leave it as it is',
    confirm: data.action,
  };
}

/**
 * Asks why a batch is discarded, or why a signed-off batch moves on; closes with the reason, or
 * with nothing when cancelled. The reason stays in the log with the change, for the record.
 */
@Component({
  selector: 'app-reason-dialog',
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
    <!-- The lot code is kept on one line (a phone would break it at its hyphens); one line of
    markup, so no space goes before the title. -->
    <!-- prettier-ignore -->
    <h2 mat-dialog-title>{{ words.title }} <span class="lot-code">{{ data.lotCode }}</span>?</h2>
    <form [formGroup]="form" (ngSubmit)="confirm()" data-testid="reason-dialog">
      <mat-dialog-content>
        <p>{{ words.lead }}</p>
        <mat-form-field class="reason" subscriptSizing="dynamic">
          <mat-label>Reason</mat-label>
          <textarea
            matInput
            formControlName="reason"
            rows="3"
            maxlength="500"
            required
            cdkFocusInitial
            data-testid="reason-input"
          ></textarea>
          <mat-hint>{{ words.hint }}</mat-hint>
          @if (form.controls.reason.hasError('required')) {
            <mat-error>{{ words.missing }}</mat-error>
          }
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button matButton type="button" mat-dialog-close data-testid="reason-cancel">
          {{ words.keep }}
        </button>
        <button
          matButton="filled"
          type="submit"
          [class.danger]="data.to === 'discarded'"
          data-testid="reason-confirm"
        >
          {{ words.confirm }}
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
export class ReasonDialog {
  private readonly dialog = inject<MatDialogRef<ReasonDialog, string>>(MatDialogRef);
  protected readonly data = inject<ReasonDialogData>(MAT_DIALOG_DATA);
  protected readonly words = wordsFor(this.data);
  protected readonly form = inject(NonNullableFormBuilder).group({
    reason: ['', [Validators.required, Validators.maxLength(500), Validators.pattern(/\S/)]],
  });

  protected confirm(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.dialog.close(this.form.getRawValue().reason.trim());
  }
}
