import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';

/**
 * Below a newest-first list read a page at a time (the audit log, the outbox): why the last page
 * failed with "Try again", the button for older pages, or a line saying that is all.
 */
@Component({
  selector: 'app-older-pages-footer',
  imports: [MatButton, MatIcon],
  templateUrl: './older-pages-footer.html',
  styleUrl: './older-pages-footer.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OlderPagesFooter {
  /** Whether the first page has come back. */
  readonly loaded = input.required<boolean>();
  /** Whether a page is being fetched. */
  readonly loading = input.required<boolean>();
  /** Whether there are older items to fetch. */
  readonly hasMore = input.required<boolean>();
  /** Why the last page could not be fetched, or null. */
  readonly failure = input.required<string | null>();
  /** Whether the list shows nothing: then there is no "that is all" line either. */
  readonly empty = input.required<boolean>();
  /** The start of the test ids: "audit" gives audit-failure and audit-load-more. */
  readonly testIdPrefix = input.required<string>();
  /** The button's words: "Load older entries". */
  readonly olderLabel = input.required<string>();
  /** The button's words while a page is read: "Loading older entries…". */
  readonly loadingLabel = input.required<string>();
  /** The line under the last page: "That is the whole log." */
  readonly endText = input.required<string>();

  /** Asks for the page of older items (also "Try again" once the first page is there). */
  readonly older = output();
  /** Asks for the first page again ("Try again" before it came). */
  readonly reload = output();
}
