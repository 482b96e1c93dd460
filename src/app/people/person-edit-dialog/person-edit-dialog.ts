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
import { ROLE_OPTIONS, roleLabel } from '../role-options';
import {
  EverywhereChoice,
  SiteChoice,
  adminEverywhere,
  roleChanges,
  roleChoices,
} from '../site-roles';

/**
 * Changes a person's display name, e-mail and role; on an install of several sites, their role at
 * every site and at each site. Closes with the changed person.
 */
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
  private readonly session = inject(SessionStore);
  protected readonly isSelf = this.session.person()?.id === this.person.id;
  protected readonly roles = ROLE_OPTIONS;
  protected readonly rules = { DISPLAY_NAME_MAX };
  /** The sites of a group (an admin of the group sees them all); none on a single kitchen. */
  protected readonly sites = this.session.sites();
  private readonly startChoices = roleChoices(this.person, this.sites);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly form = this.fb.group({
    displayName: [
      this.person.displayName,
      [Validators.required, Validators.maxLength(DISPLAY_NAME_MAX)],
    ],
    email: [
      this.person.email ?? '',
      [Validators.pattern(EMAIL_PATTERN), Validators.maxLength(EMAIL_MAX)],
    ],
    role: [this.startChoices.everywhere as EverywhereChoice],
    siteRoles: this.fb.record<SiteChoice>(this.startChoices.sites),
  });
  protected readonly role = toSignal(this.form.controls.role.valueChanges, {
    initialValue: this.startChoices.everywhere,
  });
  /** Whether an admin is about to take away their own admin role (at every site). */
  protected readonly losesOwnAdmin = computed(
    () => this.isSelf && adminEverywhere(this.person) && this.role() !== 'admin',
  );
  /** What a site without a role of its own gets, in words. */
  protected readonly sameChoice = computed(() => {
    const role = this.role();
    return role === 'none' ? 'No role here' : `As at every site (${roleLabel(role)})`;
  });
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
    const { displayName, email, role, siteRoles } = this.form.getRawValue();
    const newEmail = email.trim() || null;
    return {
      ...(displayName.trim() !== this.person.displayName
        ? { displayName: displayName.trim() }
        : {}),
      ...(newEmail !== this.person.email ? { email: newEmail } : {}),
      ...roleChanges(this.person, { everywhere: role, sites: siteRoles }),
    };
  }
}
