import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { PASSWORD_MIN } from '../../people/person-rules';
import type { NewPasswordControls } from './new-password-controls';

/**
 * A new password typed twice, with its hint and errors: the fields that changing one's password
 * and setting it from an invitation share. The form around them says when the two differ.
 */
@Component({
  selector: 'app-new-password-fields',
  imports: [ReactiveFormsModule, MatFormField, MatLabel, MatHint, MatError, MatInput],
  templateUrl: './new-password-fields.html',
  styleUrl: './new-password-fields.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NewPasswordFields {
  /** The controls from `newPasswordControls`, in the form that submits them. */
  readonly controls = input.required<NewPasswordControls>();
  /** Whether the passwords show as typed. */
  readonly shown = input(false);

  protected readonly rules = { PASSWORD_MIN };
}
