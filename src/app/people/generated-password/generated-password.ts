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

/** A password the server made up, shown this once, with a button that copies it. */
@Component({
  selector: 'app-generated-password',
  imports: [CdkCopyToClipboard, MatButton, MatIcon],
  templateUrl: './generated-password.html',
  styleUrl: './generated-password.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class GeneratedPassword {
  private readonly copyButton = viewChild.required('copyButton', { read: ElementRef });

  /** The password to show. */
  readonly password = input.required<string>();
  /** Whose password it is (their display name). */
  readonly owner = input.required<string>();

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
