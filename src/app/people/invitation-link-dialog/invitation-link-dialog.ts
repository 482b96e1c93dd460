import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogTitle,
} from '@angular/material/dialog';
import { InvitationLink } from '../invitation-link/invitation-link';
import { InvitationSent } from '../invitation-sent';

/** What the dialog shows: a new invitation's link and whom it is for. */
export interface InvitationLinkDialogData {
  readonly displayName: string;
  readonly invitation: InvitationSent & { readonly link: string };
}

/**
 * A re-sent invitation's link, shown once when no mail server takes it to the person. Opened
 * with `disableClose`: the link exists nowhere else, so only the button closes it.
 */
@Component({
  selector: 'app-invitation-link-dialog',
  imports: [
    MatDialogTitle,
    MatDialogContent,
    MatDialogActions,
    MatDialogClose,
    MatButton,
    InvitationLink,
  ],
  template: `
    <h2 mat-dialog-title>A new invitation for {{ data.displayName }}</h2>
    <mat-dialog-content data-testid="invitation-link-dialog">
      <p>The link of any earlier invitation to {{ data.displayName }} no longer works.</p>
      <app-invitation-link
        [link]="data.invitation.link"
        [owner]="data.displayName"
        [expiresAt]="data.invitation.expiresAt"
      />
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button matButton="filled" type="button" mat-dialog-close data-testid="invitation-done">
        Done, I have the link
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
export class InvitationLinkDialog {
  protected readonly data = inject<InvitationLinkDialogData>(MAT_DIALOG_DATA);
}
