import { ChangeDetectionStrategy, Component, OnInit, computed, inject } from '@angular/core';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
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
import { AUDIT_ACTIONS, AuditAction, AuditEvent, actionText, detailText } from '../audit-event';
import { AuditStore } from '../audit-store';
import { OlderPagesFooter } from '../older-pages-footer/older-pages-footer';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';

/** A row of the log with its words worked out once. */
interface AuditRow {
  readonly event: AuditEvent;
  readonly action: string;
  readonly detail: string;
}

/** The audit log: sign-ins, formula saves, batch events and people changes, newest first. */
@Component({
  selector: 'app-audit-log',
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
    MatIcon,
    MatFormField,
    MatLabel,
    MatSelect,
    MatOption,
    MatProgressBar,
    OlderPagesFooter,
  ],
  templateUrl: './audit-log.html',
  styleUrls: ['../people-tab.css', './audit-log.css'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class AuditLog implements OnInit {
  private readonly store = inject(AuditStore);

  protected readonly actions = AUDIT_ACTIONS;
  protected readonly action = this.store.action;
  protected readonly loading = this.store.loading;
  protected readonly loaded = this.store.loaded;
  protected readonly failure = this.store.failure;
  protected readonly hasMore = this.store.hasMore;
  protected readonly rows = computed<readonly AuditRow[]>(() =>
    this.store.events().map((event) => ({
      event,
      action: actionText(event),
      detail: detailText(event),
    })),
  );
  protected readonly columns = ['at', 'who', 'action', 'subject', 'detail'];

  ngOnInit(): void {
    void this.store.load();
  }

  protected showAction(choice: AuditAction | 'all'): void {
    void this.store.load(choice === 'all' ? null : choice);
  }

  protected reload(): void {
    void this.store.load();
  }

  protected loadMore(): void {
    void this.store.loadMore();
  }
}
