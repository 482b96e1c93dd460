import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { BatchStatusChip } from '../../ui/batch-sheet/batch-status-chip';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import type { LogRow } from './log-row';

/**
 * The batch log where its table does not fit (a phone, a tablet): one card a batch, stacked, in
 * the log's order — its lot (to the batch page), formula, status, days, the check verdict and the
 * overdue and sign-off marks, each in words beside its icon.
 */
@Component({
  selector: 'app-batch-log-cards',
  imports: [RouterLink, MatIcon, BatchStatusChip, IsoDayPipe],
  templateUrl: './batch-log-cards.html',
  styleUrls: ['../../ui/verdict.css', './log-marks.css', './batch-log-cards.css'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BatchLogCards {
  /** The page's batches, in the log's order. */
  readonly rows = input.required<readonly LogRow[]>();
}
