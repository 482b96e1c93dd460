import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogRef,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { Person } from '../../core/api/api-types';
import { messageOf } from '../../core/api/message-of';
import { SessionStore } from '../../core/auth/session-store';
import { PeopleStore, PersonChanges } from '../people-store';
import { DISPLAY_NAME_MAX, EMAIL_MAX, EMAIL_PATTERN } from '../person-rules';
import { ROLE_OPTIONS } from '../role-options';

/** Changes a person's display name, e-mail and role. Closes with the changed person. */
@Component({
  selector: 'app-person-edit-dialog',
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
    MatSelect,
    MatOption,
    MatButton,
    MatProgressBar,
  ],
  templateUrl: './person-edit-dialog.html',
  styleUrl: './person-edit-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PersonEditDialog {
  private readonly store = inject(PeopleStore);
  private readonly dialogRef = inject<MatDialogRef<PersonEditDialog, Person>>(MatDialogRef);

  /** The person as the list showed them. */
  protected readonly person = inject<Person>(MAT_DIALOG_DATA);
  protected readonly isSelf = inject(SessionStore).person()?.id === this.person.id;
  protected readonly roles = ROLE_OPTIONS;
  protected readonly rules = { DISPLAY_NAME_MAX };
  protected readonly form = inject(NonNullableFormBuilder).group({
    displayName: [
      this.person.displayName,
      [Validators.required, Validators.maxLength(DISPLAY_NAME_MAX)],
    ],
    email: [
      this.person.email ?? '',
      [Validators.pattern(EMAIL_PATTERN), Validators.maxLength(EMAIL_MAX)],
    ],
    role: [this.person.role],
  });
  private readonly role = toSignal(this.form.controls.role.valueChanges, {
    initialValue: this.person.role,
  });
  /** Whether an admin is about to take away their own admin role. */
  protected readonly losesOwnAdmin = computed(
    () => this.isSelf && this.person.role === 'admin' && this.role() !== 'admin',
  );
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected async saveChanges(): Promise<void> {
    if (this.form.invalid || this.busy()) {
      this.form.markAllAsTouched();
      return;
    }
    const changes = this.changes();
    if (Object.keys(changes).length === 0) {
      this.dialogRef.close();
      return;
    }
    this.busy.set(true);
    this.failure.set(null);
    try {
      this.dialogRef.close(await this.store.change(this.person.id, changes));
    } catch (error) {
      this.failure.set(messageOf(error, 'The changes could not be saved; try again.', 'sentence'));
    } finally {
      this.busy.set(false);
    }
  }

  // Only what changed goes to the server, so the audit log records only that.
  private changes(): PersonChanges {
    const { displayName, email, role } = this.form.getRawValue();
    const newEmail = email.trim() || null;
    return {
      ...(displayName.trim() !== this.person.displayName
        ? { displayName: displayName.trim() }
        : {}),
      ...(newEmail !== this.person.email ? { email: newEmail } : {}),
      ...(role !== this.person.role ? { role } : {}),
    };
  }
}
