import { ChangeDetectionStrategy, Component, OnInit, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { BatchStatusChip } from '../../ui/batch-sheet/batch-status-chip';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import { CuringBoard } from '../curing-board';
import { daysLeftWords } from '../days-left';

/**
 * Curing now: every batch that is curing or proofing, overdue ones first and marked, with its
 * ready date and the days it has left; each opens its batch page.
 */
@Component({
  selector: 'app-curing-now',
  imports: [RouterLink, MatButton, MatIcon, MatProgressBar, BatchStatusChip, IsoDayPipe],
  templateUrl: './curing-now.html',
  styleUrl: './curing-now.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class CuringNow implements OnInit {
  protected readonly board = inject(CuringBoard);
  protected readonly daysLeftWords = daysLeftWords;

  ngOnInit(): void {
    void this.board.load();
  }
}
