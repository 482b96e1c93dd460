import { ChangeDetectionStrategy, Component, OnInit, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { BatchStatusChip } from '../../ui/batch-sheet/batch-status-chip';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import { AttentionNow } from '../attention-now';
import { CuringBoard } from '../curing-board';
import { daysLeftWords } from '../days-left';
import { NeedsAttention } from '../needs-attention/needs-attention';

/**
 * Curing now: what needs attention now (readings due, cooling deadlines, holds), then every
 * batch that is curing or proofing, overdue ones first and marked, with its ready date and the
 * days it has left; each opens its batch page.
 */
@Component({
  selector: 'app-curing-now',
  imports: [
    RouterLink,
    MatButton,
    MatIcon,
    MatProgressBar,
    BatchStatusChip,
    IsoDayPipe,
    NeedsAttention,
  ],
  templateUrl: './curing-now.html',
  styleUrl: './curing-now.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class CuringNow implements OnInit {
  protected readonly board = inject(CuringBoard);
  private readonly attention = inject(AttentionNow);
  protected readonly daysLeftWords = daysLeftWords;

  ngOnInit(): void {
    void this.board.load();
  }

  protected refresh(): void {
    void this.board.load();
    void this.attention.load();
  }
}
