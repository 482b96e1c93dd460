import { FormControl, Validators } from '@angular/forms';
import { PASSWORD_MAX, PASSWORD_MIN } from '../../people/person-rules';

/** A new password and the same typed again, as `NewPasswordFields` shows them. */
export interface NewPasswordControls {
  password: FormControl<string>;
  repeat: FormControl<string>;
}

/**
 * The controls of a new password typed twice, with the server's length rules; the form group
 * adds `newPasswordChecks` (password-checks.ts) to compare them.
 */
export function newPasswordControls(): NewPasswordControls {
  return {
    password: new FormControl('', {
      nonNullable: true,
      validators: [
        Validators.required,
        Validators.minLength(PASSWORD_MIN),
        Validators.maxLength(PASSWORD_MAX),
      ],
    }),
    repeat: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
  };
}
