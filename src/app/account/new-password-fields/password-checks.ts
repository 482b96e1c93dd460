import type { AbstractControl, ValidationErrors } from '@angular/forms';

/**
 * Checks a form with a new password typed twice (`password`, `repeat`) and, when it has one, the
 * current password (`current`): 'mismatch' when the two new ones differ, 'unchanged' when the new
 * one is the current one. Empty fields are left to their own `required`.
 * @param group The form group.
 * @returns The errors found, or null.
 */
export function newPasswordChecks(group: Pick<AbstractControl, 'value'>): ValidationErrors | null {
  const { current, password, repeat } = group.value as Partial<Record<string, string>>;
  const errors: ValidationErrors = {};
  if (repeat && password !== repeat) errors['mismatch'] = true;
  if (password && current !== undefined && password === current) errors['unchanged'] = true;
  return Object.keys(errors).length ? errors : null;
}
