import { FormControl, Validators } from '@angular/forms';
import { PASSWORD_MAX, PASSWORD_MIN } from '../../people/person-rules';

/**
 * The controls of a new password typed twice, with the server's length rules; the form group
 * adds `newPasswordChecks` (password-checks.ts) to compare them.
 */
export function newPasswordControls(): {
  password: FormControl<string>;
  repeat: FormControl<string>;
} {
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
