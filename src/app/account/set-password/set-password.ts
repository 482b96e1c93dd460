import {
  ChangeDetectionStrategy,
  Component,
  OnInit,
  computed,
  inject,
  input,
  signal,
} from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { messageOf } from '../../core/api/message-of';
import { InvitationStore } from '../invitation-store';
import { newPasswordControls } from '../new-password-fields/new-password-controls';
import { NewPasswordFields } from '../new-password-fields/new-password-fields';
import { newPasswordChecks } from '../new-password-fields/password-checks';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';

/**
 * The page an invitation's link opens, outside the sign-in: it says for whom the link is, takes
 * a new password twice, sets it, and sends the person to sign in. A link that no longer works
 * says why and what to do.
 */
@Component({
  selector: 'app-set-password',
  imports: [
    IsoDayPipe,
    ReactiveFormsModule,
    RouterLink,
    MatCheckbox,
    MatButton,
    MatIcon,
    MatProgressBar,
    NewPasswordFields,
  ],
  providers: [InvitationStore],
  templateUrl: './set-password.html',
  styleUrls: ['../../core/auth/sign-in/sign-in.css', './set-password.css'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class SetPassword implements OnInit {
  private readonly store = inject(InvitationStore);
  private readonly router = inject(Router);

  /** The invitation's token, from the link's query string. */
  readonly token = input<string>();

  protected readonly view = this.store.view;
  protected readonly invitation = computed(() => {
    const view = this.view();
    return view.step === 'valid' ? view.invitation : null;
  });
  protected readonly refusal = computed(() => {
    const view = this.view();
    return view.step === 'refused' ? view.refusal : null;
  });
  protected readonly form = inject(NonNullableFormBuilder).group(newPasswordControls(), {
    validators: [newPasswordChecks],
  });
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly shown = signal(false);

  ngOnInit(): void {
    void this.store.check(this.token());
  }

  protected async setPassword(): Promise<void> {
    if (this.form.invalid || this.busy()) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.failure.set(null);
    try {
      const accepted = await this.store.accept(this.form.getRawValue().password);
      if (accepted) {
        // Replaces this page in the history, so Back does not lead to a used link.
        await this.router.navigate(['/sign-in'], {
          queryParams: { username: accepted.username, passwordSet: 'yes' },
          replaceUrl: true,
        });
      }
    } catch (error) {
      this.failure.set(messageOf(error, 'The password could not be set; try again.', 'sentence'));
    } finally {
      this.busy.set(false);
    }
  }
}
