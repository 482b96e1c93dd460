import { ChangeDetectionStrategy, Component, input, viewChild } from '@angular/core';
import { ShownOnce } from '../shown-once/shown-once';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';

/**
 * An invitation's set-password link, shown this once to the admin who sent it because no mail
 * server takes it to the person; the server keeps no copy of it.
 */
@Component({
  selector: 'app-invitation-link',
  imports: [IsoDayPipe, ShownOnce],
  template: `
    <app-shown-once
      [value]="link()"
      caption="Their invitation link"
      copyLabel="Copy link"
      valueTestId="invitation-link"
      copyTestId="copy-invitation-link"
    >
      <strong>Copy this link now: it is shown only once.</strong> No mail server is set up, so the
      invitation did not leave this machine. Give the link to {{ owner() }} yourself, in person or
      in a private message: it lets them choose their own password, once, until
      {{ expiresAt() | isoDay: 'moment' }}. The outbox keeps the message without the link; if it
      gets lost, send a new invitation.
    </app-shown-once>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InvitationLink {
  private readonly shown = viewChild.required(ShownOnce);

  /** The set-password link. */
  readonly link = input.required<string>();
  /** Whom it is for (their display name). */
  readonly owner = input.required<string>();
  /** When it stops working (ISO 8601). */
  readonly expiresAt = input.required<string>();

  /** Puts the keyboard focus on the copy button. */
  focus(): void {
    this.shown().focus();
  }
}
