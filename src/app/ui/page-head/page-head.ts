import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';

/**
 * The head of a page that shows what the API holds: its title (and a line under it, projected
 * with the `note` attribute), a Refresh button, and the page's own actions (projected) after it,
 * every button 48 px tall for a gloved finger.
 */
@Component({
  selector: 'app-page-head',
  imports: [MatButton, MatIcon],
  templateUrl: './page-head.html',
  styleUrl: './page-head.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PageHead {
  /** The page's title, its one h1. */
  readonly heading = input.required<string>();
  /** While the page is reading: Refresh waits. */
  readonly busy = input(false);
  /** Refresh was pressed. */
  readonly refresh = output<void>();
}
