import { CdkCopyToClipboard } from '@angular/cdk/clipboard';
import {
  ChangeDetectionStrategy,
  Component,
  OnInit,
  computed,
  inject,
  signal,
} from '@angular/core';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { messageOf } from '../../core/api/message-of';
import {
  OutboxMessage,
  OutboxSummary,
  deliveryStatus,
  invitationNote,
  kindText,
  recipientText,
} from '../outbox-message';
import { OutboxStore } from '../outbox-store';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';

/**
 * One message of the outbox: who it went to, where it is, and its plain-text body. The HTML body
 * is never rendered: it came from the server's templates with names people typed in.
 */
@Component({
  selector: 'app-outbox-message-dialog',
  imports: [
    CdkCopyToClipboard,
    IsoDayPipe,
    MatDialogTitle,
    MatDialogContent,
    MatDialogActions,
    MatDialogClose,
    MatButton,
    MatIcon,
    MatProgressBar,
  ],
  templateUrl: './outbox-message-dialog.html',
  styleUrl: './outbox-message-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OutboxMessageDialog implements OnInit {
  private readonly store = inject(OutboxStore);

  /** The message as the list showed it. */
  protected readonly summary = inject<OutboxSummary>(MAT_DIALOG_DATA);
  protected readonly recipient = recipientText(this.summary);
  protected readonly kind = kindText(this.summary.kind);
  /** Where an invitation's link went: the copy kept here has none. */
  protected readonly linkNote = invitationNote(this.summary);
  protected readonly loading = signal(true);
  protected readonly failure = signal<string | null>(null);
  /** The whole message, once fetched. */
  protected readonly message = signal<OutboxMessage | null>(null);
  /** When it was sent and how, from the fetched message (fresher than the list's row). */
  protected readonly sentAt = computed(() => (this.message() ?? this.summary).sentAt);
  protected readonly status = computed(() => deliveryStatus(this.message() ?? this.summary));
  /** Whether the last copy of the text worked. */
  protected readonly copied = signal(false);

  async ngOnInit(): Promise<void> {
    try {
      this.message.set(await this.store.message(this.summary.id));
    } catch (error) {
      this.failure.set(messageOf(error, 'The message could not be loaded; try again.', 'sentence'));
    } finally {
      this.loading.set(false);
    }
  }
}
