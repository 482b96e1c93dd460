import {
  ChangeDetectionStrategy,
  Component,
  OnInit,
  computed,
  inject,
  signal,
} from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { SAFE_WORKFLOW_RULES } from '../../../../shared/workflow/workflow-rules.ts';
import { offeredMoves } from '../../batches/batch-status';
import { BatchLog } from '../../batches/batch-log/batch-log';
import { ReasonDialog, type ReasonDialogData } from '../../batches/batch-page/reason-dialog';
import { SessionStore } from '../../core/auth/session-store';
import { LoadState } from '../../ui/load-state/load-state';
import { PageHead } from '../../ui/page-head/page-head';
import { AttentionNow } from '../attention-now';
import { weekdayDayWords } from '../../../../shared/presentation/date-words.ts';
import { BoardCard } from '../board-card/board-card';
import type { BoardRow } from '../board-rows';
import { CuringBoard } from '../curing-board';
import { MarkDoneDialog, type MarkDoneData } from '../mark-done-dialog';
import { NeedsAttention } from '../needs-attention/needs-attention';
import { SignOffQueue } from '../sign-off-queue';

/**
 * Today: a cook's daily board. What needs attention now (readings due, cooling deadlines,
 * holds); then the cures — overdue, ready today and a turn owed first — and the doughs
 * proofing, apart; each a card with its quick actions. A reviewer sees the sign-off queue too.
 */
@Component({
  selector: 'app-today-board',
  imports: [RouterLink, MatIcon, BoardCard, LoadState, NeedsAttention, PageHead],
  templateUrl: './today-board.html',
  styleUrl: './today-board.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class TodayBoard implements OnInit {
  protected readonly board = inject(CuringBoard);
  protected readonly queue = inject(SignOffQueue);
  private readonly attention = inject(AttentionNow);
  private readonly session = inject(SessionStore);
  private readonly dialog = inject(MatDialog);
  private readonly log = inject(BatchLog);
  private readonly snackBar = inject(MatSnackBar);

  /** The day at the head of the board, in the product's words: "Thu 3 Dec 2026". */
  protected readonly today = weekdayDayWords(new Date());
  /** Cooks and admins move batches along; reviewers look and sign off. */
  protected readonly canMove = computed(() => this.session.hasRole('admin', 'cook'));
  protected readonly reviews = computed(() => this.session.hasRole('admin', 'reviewer'));
  /** The board's two lists, cures and doughs, each under its own heading. */
  protected readonly sections = computed(() => [
    {
      key: 'curing',
      title: 'Curing',
      rows: this.board.board().curing,
      empty: 'No cure is curing.',
    },
    {
      key: 'proofing',
      title: 'Proofing',
      rows: this.board.board().proofing,
      empty: 'No dough is proofing.',
    },
  ]);
  /** The lot being moved, and why the last move of each lot failed. */
  protected readonly moving = signal<string | null>(null);
  protected readonly failures = signal<Readonly<Partial<Record<string, string>>>>({});

  ngOnInit(): void {
    void this.board.load();
    if (this.reviews()) void this.queue.load();
  }

  protected refresh(): void {
    void this.board.load();
    void this.attention.load();
    if (this.reviews()) void this.queue.load();
  }

  /**
   * Why marking this batch done is held back for the signed-in person, as the kitchen's rules
   * say in their safe form (every rule on); the server has the last word either way.
   */
  protected doneBlocked(row: BoardRow): string | null {
    const person = this.session.person();
    if (!person) return null;
    const done = offeredMoves(row.batch, person, SAFE_WORKFLOW_RULES).find((m) => m.to === 'done');
    return done ? done.blocked : 'This batch cannot be marked done from here.';
  }

  /** Records today's turn of a cure, and says so in a snack-bar; a refusal shows on its card. */
  protected async markTurned(row: BoardRow): Promise<void> {
    const lot = row.batch.lotCode;
    if (this.moving()) return;
    this.moving.set(lot);
    const failure = await this.board.markTurned(lot);
    this.moving.set(null);
    this.noteFailure(lot, failure);
    if (!failure) {
      this.log.invalidate();
      this.snackBar.open(`Turned — recorded for ${lot}`, 'Close', { duration: 6000 });
    }
  }

  /** Asks, then marks the batch done; a signed-off batch asks an admin's reason instead. */
  protected async markDone(row: BoardRow): Promise<void> {
    const { batch } = row;
    const person = this.session.person();
    if (!person || this.moving()) return;
    const done = offeredMoves(batch, person, SAFE_WORKFLOW_RULES).find((m) => m.to === 'done');
    if (!done || done.blocked) return;
    let reason: string | undefined;
    if (done.needsReason) {
      const asked = this.dialog.open<ReasonDialog, ReasonDialogData, string>(ReasonDialog, {
        data: { lotCode: batch.lotCode, to: 'done', action: done.action },
        width: '520px',
      });
      reason = await firstValueFrom(asked.afterClosed());
      if (!reason) return;
    } else {
      const asked = this.dialog.open<MarkDoneDialog, MarkDoneData, boolean>(MarkDoneDialog, {
        data: {
          lotCode: batch.lotCode,
          formulaTitle: batch.formula.title,
          status: batch.status === 'proofing' ? 'proofing' : 'curing',
        },
        width: '480px',
      });
      if (!(await firstValueFrom(asked.afterClosed()))) return;
    }
    this.moving.set(batch.lotCode);
    const failure = await this.board.markDone(batch.lotCode, reason);
    this.moving.set(null);
    this.noteFailure(batch.lotCode, failure);
    if (!failure) {
      this.log.invalidate();
      void this.attention.load();
      if (this.reviews()) void this.queue.load();
    }
  }

  /** Keeps why a lot's last action failed, or forgets it when the action went through. */
  private noteFailure(lot: string, failure: string | null): void {
    const { [lot]: _old, ...others } = this.failures();
    this.failures.set(failure ? { ...others, [lot]: failure } : others);
  }
}
