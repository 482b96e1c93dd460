import { CdkCopyToClipboard } from '@angular/cdk/clipboard';
import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  input,
  signal,
  viewChild,
} from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';

/**
 * A secret the server shows this once (a made-up password, an invitation link), with a button
 * that copies it. What to do with it is the projected content, shown above it.
 */
@Component({
  selector: 'app-shown-once',
  imports: [CdkCopyToClipboard, MatButton, MatIcon],
  templateUrl: './shown-once.html',
  styleUrl: './shown-once.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ShownOnce {
  private readonly copyButton = viewChild.required('copyButton', { read: ElementRef });

  /** The secret to show. */
  readonly value = input.required<string>();
  /** What it is, above it: "Their new password". */
  readonly caption = input.required<string>();
  /** The copy button's words: "Copy password". */
  readonly copyLabel = input.required<string>();
  /** Test ids of the shown value and of the copy button. */
  readonly valueTestId = input.required<string>();
  readonly copyTestId = input.required<string>();

  /** How the last copy went: null before the first. */
  protected readonly copied = signal<'copied' | 'failed' | null>(null);

  /** Puts the keyboard focus on the copy button (the form that had it is gone). */
  focus(): void {
    (this.copyButton().nativeElement as HTMLElement).focus();
  }

  protected noteCopy(succeeded: boolean): void {
    this.copied.set(succeeded ? 'copied' : 'failed');
  }
}
