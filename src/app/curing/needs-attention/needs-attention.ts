import { ChangeDetectionStrategy, Component, DestroyRef, OnInit, inject } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { UnitsTogetherPipe } from '../../ui/units-together';
import { RouterLink } from '@angular/router';
import { clockWords } from '../../batches/process/process-words';
import { AttentionNow } from '../attention-now';

/** How often the list is read again while the board is open. */
const REFRESH_MS = 60_000;

/** Each kind: its icon, its name, and the quick action its link leads to on the batch page. */
const KIND = {
  deviation: { icon: 'front_hand', words: 'On hold', action: 'Record the action' },
  'stage-deadline': { icon: 'ac_unit', words: 'Cooling deadline', action: 'Enter a reading' },
  'reading-due': { icon: 'thermostat', words: 'Reading due', action: 'Enter a reading' },
} as const;

/**
 * "Needs attention now" at the top of the curing board: readings due, cooling deadlines and
 * batches on hold, most urgent first, each opening its batch.
 */
@Component({
  selector: 'app-needs-attention',
  imports: [RouterLink, MatIcon, UnitsTogetherPipe],
  templateUrl: './needs-attention.html',
  styleUrl: './needs-attention.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NeedsAttention implements OnInit {
  protected readonly now = inject(AttentionNow);
  protected readonly kind = KIND;
  private readonly destroyRef = inject(DestroyRef);

  ngOnInit(): void {
    void this.now.load();
    const timer = setInterval(() => void this.now.load(), REFRESH_MS);
    this.destroyRef.onDestroy(() => clearInterval(timer));
  }

  protected when(iso: string): string {
    return clockWords(iso, this.now.readAt());
  }

  protected late(iso: string): boolean {
    return new Date(iso).getTime() < this.now.readAt().getTime();
  }
}
