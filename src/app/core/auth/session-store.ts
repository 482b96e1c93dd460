import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { DemoInfo, Person, Role, SessionInfo, SessionState } from '../api/api-types';

/** Who is signed in, and the CSRF token their changes must carry. */
@Injectable({ providedIn: 'root' })
export class SessionStore {
  private readonly http = inject(HttpClient);
  /** undefined until the first check; null when nobody is signed in. */
  private readonly session = signal<SessionInfo | null | undefined>(undefined);

  /** The signed-in person, or null. */
  readonly person = computed(() => this.session()?.person ?? null);
  /** The CSRF token of the session, or null. */
  readonly csrfToken = computed(() => this.session()?.csrfToken ?? null);

  /** Whether the signed-in person has one of the roles. */
  hasRole(...roles: Role[]): boolean {
    const role = this.person()?.role;
    return role !== undefined && roles.includes(role);
  }

  /** Asks the server once who is signed in (a cookie from an earlier visit may still be valid). */
  async ensureLoaded(): Promise<Person | null> {
    if (this.session() !== undefined) return this.person();
    // Signed out is answered 200 with no person, so a first visit logs no error.
    const state = await firstValueFrom(this.http.get<SessionState>('/api/session'));
    this.session.set(state.person ? state : null);
    return this.person();
  }

  /** Whether this server is the demo, and its sign-ins if so (for the sign-in page). */
  demo(): Promise<DemoInfo> {
    return firstValueFrom(this.http.get<DemoInfo>('/api/session/demo'));
  }

  /** Signs in with the form; rejects with an ApiError (wrong password, throttled). */
  async signIn(username: string, password: string): Promise<Person> {
    const session = await firstValueFrom(
      this.http.post<SessionInfo>('/api/session', { username, password }),
    );
    this.session.set(session);
    return session.person;
  }

  /** Signs out on the server and forgets the session here. */
  async signOut(): Promise<void> {
    try {
      await firstValueFrom(this.http.delete<void>('/api/session'));
    } finally {
      this.session.set(null);
    }
  }

  /** Forgets the session without asking the server (it already ended it). */
  forget(): void {
    this.session.set(null);
  }
}
