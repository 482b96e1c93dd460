import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogTitle,
} from '@angular/material/dialog';

/** The batch the dialog asks about. */
export interface MarkDoneData {
  readonly lotCode: string;
  readonly formulaTitle: string;
  /** "curing" or "proofing": what the batch stops doing. */
  readonly status: 'curing' | 'proofing';
}

/**
 * Asks before the board marks a batch done: the move is final (a done batch is not moved on) and
 * is checked against its process record by the server. Closes with true to go ahead.
 */
@Component({
  selector: 'app-mark-done-dialog',
  imports: [MatDialogTitle, MatDialogContent, MatDialogActions, MatDialogClose, MatButton],
  template: `
    <h2 mat-dialog-title>Mark {{ data.lotCode }} done?</h2>
    <mat-dialog-content>
      <p>
        {{ data.formulaTitle }} stops {{ data.status }} and leaves the board. A done batch cannot be
        moved back; it then waits for a reviewer's sign-off.
      </p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button matButton type="button" [mat-dialog-close]="false" data-testid="mark-done-cancel">
        Keep {{ data.status }}
      </button>
      <button
        matButton="filled"
        type="button"
        [mat-dialog-close]="true"
        cdkFocusInitial
        data-testid="mark-done-confirm"
      >
        Mark done
      </button>
    </mat-dialog-actions>
  `,
  styles: `
    button {
      min-height: 48px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MarkDoneDialog {
  protected readonly data = inject<MarkDoneData>(MAT_DIALOG_DATA);
}
