import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import {
  AbstractControl,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  ValidationErrors,
  Validators,
} from '@angular/forms';
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
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { ApiError } from '../../core/api/api-error';
import { SessionStore } from '../../core/auth/session-store';
import { failureText } from '../failure-text';
import { PeopleStore } from '../people-store';
import { PASSWORD_MAX, PASSWORD_MIN } from '../person-rules';

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
    MatHint,
    MatError,
    MatInput,
    MatCheckbox,
    MatButton,
    MatIcon,
    MatProgressBar,
  ],
  templateUrl: './change-password.html',
  styleUrl: './change-password.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChangePassword {
  private readonly store = inject(PeopleStore);

  protected readonly username = inject(SessionStore).person()?.username ?? '';
  protected readonly rules = { PASSWORD_MIN };
  protected readonly form = inject(NonNullableFormBuilder).group(
    {
      current: ['', Validators.required],
      password: [
        '',
        [
          Validators.required,
          Validators.minLength(PASSWORD_MIN),
          Validators.maxLength(PASSWORD_MAX),
        ],
      ],
      repeat: ['', Validators.required],
    },
    { validators: [passwordsAgree] },
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
      this.failure.set(failureText(error, 'The password could not be changed; try again.'));
    } finally {
      this.busy.set(false);
    }
  }

  protected toggleShown(shown: boolean): void {
    this.shown.set(shown);
  }
}

// The repeat must match; the new password must differ from the current one.
function passwordsAgree(group: AbstractControl): ValidationErrors | null {
  const { current, password, repeat } = group.value as Record<string, string>;
  const errors: ValidationErrors = {};
  if (repeat && password !== repeat) errors['mismatch'] = true;
  if (password && password === current) errors['unchanged'] = true;
  return Object.keys(errors).length ? errors : null;
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
