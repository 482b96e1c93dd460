import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import {
  MatDialog,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogRef,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { ApiError } from '../../core/api/api-error';
import { messageOf } from '../../core/api/message-of';
import { SessionStore } from '../../core/auth/session-store';
import { AccountStore } from '../account-store';
import { newPasswordControls } from '../new-password-fields/new-password-controls';
import { NewPasswordFields } from '../new-password-fields/new-password-fields';
import { newPasswordChecks } from '../new-password-fields/password-checks';

/**
 * Lets whoever is signed in, whatever their role, change their own password. Closes with `true`
 * once the password is changed.
 */
@Component({
  selector: 'app-change-password',
  imports: [
    ReactiveFormsModule,
    MatDialogTitle,
    MatDialogContent,
    MatDialogActions,
    MatDialogClose,
    MatFormField,
    MatLabel,
    MatError,
    MatInput,
    MatCheckbox,
    MatButton,
    MatIcon,
    MatProgressBar,
    NewPasswordFields,
  ],
  templateUrl: './change-password.html',
  styleUrl: './change-password.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChangePassword {
  private readonly store = inject(AccountStore);

  protected readonly username = inject(SessionStore).person()?.username ?? '';
  protected readonly form = inject(NonNullableFormBuilder).group(
    { current: ['', Validators.required], ...newPasswordControls() },
    { validators: [newPasswordChecks] },
  );
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly shown = signal(false);
  /** Whether the password has been changed. */
  protected readonly done = signal(false);

  protected async changePassword(): Promise<void> {
    if (this.form.invalid || this.busy()) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.failure.set(null);
    const { current, password } = this.form.getRawValue();
    try {
      await this.store.changeOwnPassword(current, password);
      this.done.set(true);
    } catch (error) {
      if (error instanceof ApiError && error.code === 'wrong-password') {
        this.form.controls.current.setErrors({ wrong: true });
      }
      this.failure.set(
        messageOf(error, 'The password could not be changed; try again.', 'sentence'),
      );
    } finally {
      this.busy.set(false);
    }
  }

  protected toggleShown(shown: boolean): void {
    this.shown.set(shown);
  }
}

/**
 * Opens the "Change my password" dialog.
 * @param dialog The MatDialog of the caller (the shell's user menu).
 * @returns The dialog; it closes with `true` once the password is changed.
 */
export function openChangePassword(dialog: MatDialog): MatDialogRef<ChangePassword, boolean> {
  return dialog.open<ChangePassword, void, boolean>(ChangePassword, {
    width: '480px',
    maxWidth: '95vw',
  });
}
