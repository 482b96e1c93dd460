import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { BatchStatusChip } from '../../ui/batch-sheet/batch-status-chip';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import type { BoardRow } from '../board-rows';
import { daysLeftWords } from '../days-left';
import { shortDayWords } from '../../../../shared/presentation/date-words.ts';

/** What a due batch's flag says, with its icon: words first, the colour only repeats them. */
const DUE = {
  overdue: { icon: 'warning', words: (row: BoardRow) => daysLeftWords(row.daysLeft) },
  ready: { icon: 'event_available', words: () => 'Ready today' },
  turn: {
    icon: 'autorenew',
    words: (row: BoardRow, today: string) =>
      row.turn.owedSince && row.turn.owedSince < today
        ? `Turn due since ${shortDayWords(row.turn.owedSince)}`
        : row.batch.flipEveryDays === 1
          ? 'Turn today (every day)'
          : `Turn today (every ${row.batch.flipEveryDays} days)`,
  },
} as const;

/**
 * One held batch on the daily board, as a card that stacks on a phone: what is due today in
 * words, its days, and the quick actions — mark a turn done, mark it done (the page asks
 * first) and open it. A cure turned today says so, and by whom.
 */
@Component({
  selector: 'app-board-card',
  imports: [RouterLink, MatButton, MatIcon, BatchStatusChip, IsoDayPipe],
  templateUrl: './board-card.html',
  styleUrl: './board-card.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: {
    'data-testid': 'curing-row',
    '[attr.data-lot]': 'row().batch.lotCode',
    '[attr.data-overdue]': 'row().overdue',
    '[attr.data-due]': 'row().due',
  },
})
export class BoardCard {
  /** The batch and what is due today. */
  readonly row = input.required<BoardRow>();
  /** Why marking it done is held back for this person, or null when it is offered. */
  readonly doneBlocked = input<string | null>(null);
  /** Whether this person may move batches at all (a reviewer may not). */
  readonly canMove = input(false);
  /** Whether a move is on its way. */
  readonly busy = input(false);
  /** Why the last move failed, or null. */
  readonly failure = input<string | null>(null);
  /** Mark done was asked for. */
  readonly markDone = output<void>();
  /** The kitchen's calendar day the board counts from, YYYY-MM-DD. */
  readonly today = input.required<string>();
  /** Mark turned was asked for. */
  readonly markTurned = output<void>();

  protected readonly flag = computed(() => {
    const row = this.row();
    if (!row.due) return null;
    const due = DUE[row.due];
    return { kind: row.due, icon: due.icon, words: due.words(row, this.today()) };
  });
  protected readonly left = computed(() => daysLeftWords(this.row().daysLeft));
  /** Whether a turn can be marked here: a cure owes one and this person moves batches. */
  protected readonly canTurn = computed(() => this.canMove() && !!this.row().turn.owedSince);
  /**
   * The turn button's name: what it does to which batch, for a screen reader; it begins with the
   * words on the button, so a voice command of what is seen finds it.
   */
  protected readonly turnLabel = computed(
    () => `Mark turned: ${this.row().batch.formula.title}, lot ${this.row().batch.lotCode}`,
  );
}
