import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { ActivatedRoute, RouterLink } from '@angular/router';
import { map } from 'rxjs';
import type { Role } from '../../api/api-types';
import type { ForRolesData } from '../../auth/role-routes';
import { SessionStore } from '../../auth/session-store';
import { askText, rolesText } from './for-roles-text';

/** What a page for other roles shows instead: whom it is for, and whom to ask. */
@Component({
  selector: 'app-not-for-you',
  imports: [RouterLink, MatButton],
  template: `
    <h1>{{ heading() }}</h1>
    <p data-testid="not-for-you">You are signed in as {{ myRole() }}. {{ ask() }}</p>
    <a matButton="filled" routerLink="/batches">Go to the batch log</a>
  `,
  styles: `
    :host {
      display: block;
      max-width: 70ch;
    }
    a {
      min-height: 48px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class NotForYou {
  private readonly session = inject(SessionStore);
  private readonly roles = toSignal(
    inject(ActivatedRoute).data.pipe(map((data) => (data as ForRolesData).roles ?? [])),
    { initialValue: [] as readonly Role[] },
  );
  /** The active admins' names, once the server has said; empty when it could not. */
  private readonly admins = signal<readonly string[] | null>(null);

  protected readonly heading = computed(() => `This page is for ${rolesText(this.roles())}`);
  protected readonly myRole = computed(() => {
    const role = this.session.person()?.role;
    return role === 'admin' ? 'an admin' : role === 'reviewer' ? 'a reviewer' : 'a cook';
  });
  protected readonly ask = computed(() => askText(this.admins()));

  constructor() {
    inject(HttpClient)
      .get<{ admins: { displayName: string }[] }>('/api/people/admins')
      .subscribe({
        next: ({ admins }) => this.admins.set(admins.map((admin) => admin.displayName)),
        error: () => this.admins.set([]),
      });
  }
}
