import {
  ChangeDetectionStrategy,
  Component,
  Injector,
  afterNextRender,
  computed,
  inject,
  signal,
  viewChild,
} from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import {
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogRef,
  MatDialogTitle,
} from '@angular/material/dialog';
import {
  MAT_FORM_FIELD_DEFAULT_OPTIONS,
  MatError,
  MatFormField,
  MatHint,
  MatLabel,
  MatSuffix,
} from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { ApiError } from '../../core/api/api-error';
import { Role } from '../../core/api/api-types';
import { messageOf } from '../../core/api/message-of';
import { SessionStore } from '../../core/auth/session-store';
import { GeneratedPassword } from '../generated-password/generated-password';
import { InvitationLink } from '../invitation-link/invitation-link';
import { AddedPerson, PeopleStore } from '../people-store';
import {
  DISPLAY_NAME_MAX,
  EMAIL_MAX,
  EMAIL_PATTERN,
  PASSWORD_MAX,
  PASSWORD_MIN,
  USERNAME_PATTERN,
} from '../person-rules';
import { ROLE_OPTIONS } from '../role-options';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';

/**
 * Adds a person. Closes with the new person (and the invitation sent to their address); when the
 * server made up the password, or the invitation's link is the admin's to pass on (no mail
 * server), the dialog first shows it once and stays open until the admin is done with it.
 */
@Component({
  selector: 'app-person-add-dialog',
  imports: [
    IsoDayPipe,
    ReactiveFormsModule,
    MatDialogTitle,
    MatDialogContent,
    MatDialogActions,
    MatDialogClose,
    MatFormField,
    MatLabel,
    MatHint,
    MatError,
    MatSuffix,
    MatInput,
    MatSelect,
    MatOption,
    MatButton,
    MatIconButton,
    MatIcon,
    MatProgressBar,
    GeneratedPassword,
    InvitationLink,
  ],
  // A hint runs to two lines on a phone: let it push the next field down rather than overlap it.
  providers: [
    {
      provide: MAT_FORM_FIELD_DEFAULT_OPTIONS,
      useValue: { appearance: 'outline', subscriptSizing: 'dynamic' },
    },
  ],
  templateUrl: './person-add-dialog.html',
  styleUrl: './person-add-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PersonAddDialog {
  private readonly store = inject(PeopleStore);
  private readonly session = inject(SessionStore);
  /** The sites of a group (none on a single kitchen): the role holds at every one, or one. */
  protected readonly sites = this.session.sites();
  private readonly dialogRef = inject<MatDialogRef<PersonAddDialog, AddedPerson>>(MatDialogRef);
  private readonly injector = inject(Injector);
  private readonly reveal = viewChild(GeneratedPassword);
  private readonly linkReveal = viewChild(InvitationLink);

  protected readonly roles = ROLE_OPTIONS;
  protected readonly rules = { DISPLAY_NAME_MAX, PASSWORD_MIN };
  protected readonly form = inject(NonNullableFormBuilder).group({
    username: ['', [Validators.required, Validators.pattern(USERNAME_PATTERN)]],
    displayName: ['', [Validators.required, Validators.maxLength(DISPLAY_NAME_MAX)]],
    email: ['', [Validators.pattern(EMAIL_PATTERN), Validators.maxLength(EMAIL_MAX)]],
    role: ['cook' as Role],
    /** The one site the role holds at; '' for every site. */
    site: [''],
    password: ['', [Validators.minLength(PASSWORD_MIN), Validators.maxLength(PASSWORD_MAX)]],
  });
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly passwordShown = signal(false);
  /** The person added, while what is shown only once (password, invitation link) is on screen. */
  protected readonly added = signal<AddedPerson | null>(null);
  /** The closing button's words: what the admin has taken down. */
  protected readonly doneWords = computed(() => {
    const added = this.added();
    const password = added?.password !== null;
    const link = !!added?.invitation?.link;
    if (password && link) return 'Done, I have the password and the link';
    return link ? 'Done, I have the link' : 'Done, I have the password';
  });

  protected async addPerson(): Promise<void> {
    if (this.form.invalid || this.busy()) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.failure.set(null);
    const { username, displayName, email, role, site, password } = this.form.getRawValue();
    try {
      const added = await this.store.add({
        username: username.trim(),
        displayName: displayName.trim(),
        email: email.trim() || null,
        role,
        ...(site ? { site } : {}),
        ...(password ? { password } : {}),
      });
      if (added.password === null && !added.invitation?.link) {
        this.dialogRef.close(added);
        return;
      }
      // The password and the link exist nowhere else now: no closing by Escape or a stray click.
      this.dialogRef.disableClose = true;
      this.added.set(added);
      afterNextRender(() => (this.reveal() ?? this.linkReveal())?.focus(), {
        injector: this.injector,
      });
    } catch (error) {
      if (error instanceof ApiError && error.code === 'username-taken') {
        this.form.controls.username.setErrors({ taken: true });
      }
      this.failure.set(messageOf(error, 'The person could not be added; try again.', 'sentence'));
    } finally {
      this.busy.set(false);
    }
  }

  protected togglePassword(): void {
    this.passwordShown.update((shown) => !shown);
  }

  protected finish(): void {
    this.dialogRef.close(this.added() ?? undefined);
  }
}
