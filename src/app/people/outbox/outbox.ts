import { ChangeDetectionStrategy, Component, OnInit, computed, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import {
  MatCell,
  MatCellDef,
  MatColumnDef,
  MatHeaderCell,
  MatHeaderCellDef,
  MatHeaderRow,
  MatHeaderRowDef,
  MatRow,
  MatRowDef,
  MatTable,
} from '@angular/material/table';
import { OlderPagesFooter } from '../older-pages-footer/older-pages-footer';
import { OutboxMessageDialog } from '../outbox-message-dialog/outbox-message-dialog';
import {
  DeliveryStatus,
  OutboxSummary,
  deliveryStatus,
  kindText,
  transportText,
} from '../outbox-message';
import { OutboxStore } from '../outbox-store';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import { PHONE_WIDTH, mediaMatch } from '../../ui/media-match';

/** A row of the outbox with its words worked out once. */
interface OutboxRow {
  readonly message: OutboxSummary;
  readonly kind: string;
  readonly status: DeliveryStatus;
}

/** The outbox for admins: invitations and reminders, newest first, a page at a time. */
@Component({
  selector: 'app-outbox',
  imports: [
    IsoDayPipe,
    MatTable,
    MatColumnDef,
    MatHeaderCellDef,
    MatHeaderCell,
    MatCellDef,
    MatCell,
    MatHeaderRowDef,
    MatHeaderRow,
    MatRowDef,
    MatRow,
    MatButton,
    MatIcon,
    MatProgressBar,
    OlderPagesFooter,
  ],
  templateUrl: './outbox.html',
  styleUrls: ['../people-tab.css', './outbox.css'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class Outbox implements OnInit {
  private readonly store = inject(OutboxStore);
  private readonly dialog = inject(MatDialog);

  protected readonly loading = this.store.loading;
  protected readonly loaded = this.store.loaded;
  protected readonly failure = this.store.failure;
  protected readonly hasMore = this.store.hasMore;
  protected readonly transport = this.store.transport;
  protected readonly transportLine = computed(() => transportText(this.transport()));
  protected readonly rows = computed<readonly OutboxRow[]>(() =>
    this.store.messages().map((message) => ({
      message,
      kind: kindText(message.kind),
      status: deliveryStatus(message),
    })),
  );
  /** A phone: the subject carries to whom, the kind and when; the status stays beside it. */
  protected readonly narrow = mediaMatch(PHONE_WIDTH);
  protected readonly columns = computed(() =>
    this.narrow() ? ['subject', 'status'] : ['at', 'to', 'subject', 'kind', 'status'],
  );

  ngOnInit(): void {
    void this.store.load();
  }

  protected reload(): void {
    void this.store.load();
  }

  protected loadMore(): void {
    void this.store.loadMore();
  }

  protected open(message: OutboxSummary): void {
    this.dialog.open<OutboxMessageDialog, OutboxSummary>(OutboxMessageDialog, {
      width: '720px',
      maxWidth: '95vw',
      data: message,
    });
  }
}
