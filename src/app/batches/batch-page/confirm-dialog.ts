import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogTitle,
} from '@angular/material/dialog';

/** What a confirmation asks, in a cook's words. */
export interface ConfirmDialogData {
  readonly title: string;
  /** What will happen, one paragraph each. */
  readonly lines: readonly string[];
  /** The button that goes ahead: "Mark done now". */
  readonly confirm: string;
  /** The button that leaves things as they are: "Keep it curing". */
  readonly keep: string;
}

/**
 * Asks before a move that ends something (marking a batch done before its ready date); closes
 * with true to go ahead. Focus starts on the button that changes nothing.
 */
@Component({
  selector: 'app-confirm-dialog',
  imports: [MatDialogTitle, MatDialogContent, MatDialogActions, MatDialogClose, MatButton],
  template: `
    <h2 mat-dialog-title>{{ data.title }}</h2>
    <mat-dialog-content data-testid="confirm-dialog">
      @for (line of data.lines; track $index) {
        <p>{{ line }}</p>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button
        matButton
        type="button"
        [mat-dialog-close]="false"
        cdkFocusInitial
        data-testid="confirm-keep"
      >
        {{ data.keep }}
      </button>
      <button matButton="filled" type="button" [mat-dialog-close]="true" data-testid="confirm-go">
        {{ data.confirm }}
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
export class ConfirmDialog {
  protected readonly data = inject<ConfirmDialogData>(MAT_DIALOG_DATA);
}
