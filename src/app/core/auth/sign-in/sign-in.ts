import { ChangeDetectionStrategy, Component, OnInit, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatLabel, MatError } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { Router } from '@angular/router';
import { DemoInfo, DemoSignIn, Role } from '../../api/api-types';
import { messageOf } from '../../api/message-of';
import { SessionStore } from '../session-store';

const ROLE_WORDS: Readonly<Record<Role, string>> = {
  admin: 'admin: everything, people too',
  cook: 'cook: records batches',
  reviewer: 'reviewer: checks and signs off',
};

/** The sign-in page; on the demo it says so and offers the demo's sign-ins. */
@Component({
  selector: 'app-sign-in',
  imports: [
    ReactiveFormsModule,
    MatFormField,
    MatLabel,
    MatError,
    MatInput,
    MatButton,
    MatProgressBar,
  ],
  templateUrl: './sign-in.html',
  styleUrl: './sign-in.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class SignIn implements OnInit {
  private readonly session = inject(SessionStore);
  private readonly router = inject(Router);

  /** Where to go after signing in (from the query string). */
  readonly returnUrl = input<string>();
  /** The username to fill in (from the query string), after setting a password from an invitation. */
  readonly username = input<string>();
  /** 'yes' when the person has just set their password from an invitation (query string). */
  readonly passwordSet = input<string>();

  protected readonly form = inject(NonNullableFormBuilder).group({
    username: ['', Validators.required],
    password: ['', Validators.required],
  });
  protected readonly busy = signal(false);
  /** The demo's kitchen and sign-ins; null until known, and on any install but the demo. */
  protected readonly demo = signal<DemoInfo | null>(null);
  protected readonly failure = signal<string | null>(null);

  ngOnInit(): void {
    const username = this.username();
    if (username) this.form.controls.username.setValue(username);
    // Only a demo server answers with sign-ins; without the answer the page is the plain one.
    this.session.demo().then(
      (info) => this.demo.set(info.demo ? info : null),
      () => this.demo.set(null),
    );
  }

  /** Fills the form with one of the demo's sign-ins. */
  protected useDemo(person: DemoSignIn): void {
    this.form.setValue({ username: person.username, password: person.password });
    this.failure.set(null);
  }

  /** A role as the page says it. */
  protected roleWords(role: Role): string {
    return ROLE_WORDS[role];
  }

  protected async signIn(): Promise<void> {
    if (this.form.invalid || this.busy()) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.failure.set(null);
    const { username, password } = this.form.getRawValue();
    try {
      await this.session.signIn(username.trim(), password);
      const target = this.returnUrl();
      await this.router.navigateByUrl(
        target?.startsWith('/') && !target.startsWith('//') ? target : '/today',
      );
    } catch (error) {
      this.failure.set(messageOf(error, 'Signing in failed; try again.'));
    } finally {
      this.busy.set(false);
    }
  }
}
