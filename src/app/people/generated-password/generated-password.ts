import { ChangeDetectionStrategy, Component, input, viewChild } from '@angular/core';
import { ShownOnce } from '../shown-once/shown-once';

/** A password the server made up, shown this once, with a button that copies it. */
@Component({
  selector: 'app-generated-password',
  imports: [ShownOnce],
  templateUrl: './generated-password.html',
  styleUrl: './generated-password.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class GeneratedPassword {
  private readonly shown = viewChild.required(ShownOnce);

  /** The password to show. */
  readonly password = input.required<string>();
  /** Whose password it is (their display name). */
  readonly owner = input.required<string>();

  /** Puts the keyboard focus on the copy button (the form that had it is gone). */
  focus(): void {
    this.shown().focus();
  }
}
