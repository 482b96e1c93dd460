import {
  ChangeDetectionStrategy,
  Component,
  Injector,
  afterNextRender,
  inject,
  signal,
  viewChild,
} from '@angular/core';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogRef,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatProgressBar } from '@angular/material/progress-bar';
import { Person } from '../../core/api/api-types';
import { messageOf } from '../../core/api/message-of';
import { GeneratedPassword } from '../generated-password/generated-password';
import { PeopleStore } from '../people-store';

/** Asks before resetting a person's password, then shows the new one once. */
@Component({
  selector: 'app-password-reset-dialog',
  imports: [
    MatDialogTitle,
    MatDialogContent,
    MatDialogActions,
    MatDialogClose,
    MatButton,
    MatProgressBar,
    GeneratedPassword,
  ],
  templateUrl: './password-reset-dialog.html',
  styleUrl: './password-reset-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PasswordResetDialog {
  private readonly store = inject(PeopleStore);
  private readonly dialogRef = inject<MatDialogRef<PasswordResetDialog>>(MatDialogRef);
  private readonly injector = inject(Injector);
  private readonly reveal = viewChild(GeneratedPassword);

  /** Whose password is reset. */
  protected readonly person = inject<Person>(MAT_DIALOG_DATA);
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);
  /** The new password, once the server has made it up. */
  protected readonly password = signal<string | null>(null);

  protected async resetPassword(): Promise<void> {
    if (this.busy()) return;
    this.busy.set(true);
    this.failure.set(null);
    try {
      this.password.set(await this.store.resetPassword(this.person.id));
      // The password exists nowhere else now: no closing by Escape or a stray click outside.
      this.dialogRef.disableClose = true;
      afterNextRender(() => this.reveal()?.focus(), { injector: this.injector });
    } catch (error) {
      this.failure.set(messageOf(error, 'The password could not be reset; try again.', 'sentence'));
    } finally {
      this.busy.set(false);
    }
  }
}
