import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';

/**
 * Where a read from the API stands, the same on every screen: a thin progress bar while it is
 * under way (its room kept, so nothing jumps), and, when it failed, why in words with Try again.
 */
@Component({
  selector: 'app-load-state',
  imports: [MatButton, MatIcon, MatProgressBar],
  templateUrl: './load-state.html',
  styleUrl: './load-state.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LoadState {
  /** Whether a read is under way. */
  readonly loading = input(false);
  /** What is under way, for screen readers: "Reading the equipment". */
  readonly working = input('Working');
  /** Why the read failed, in words; null while it has not. */
  readonly error = input<string | null>(null);
  /** What failed, before the reason: "The equipment could not be read". */
  readonly failed = input.required<string>();
  /** Try again was pressed. */
  readonly retry = output<void>();
}
