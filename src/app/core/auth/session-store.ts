import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import {
  DemoInfo,
  Person,
  Role,
  SessionInfo,
  SessionState,
  SiteInfo,
  SiteList,
} from '../api/api-types';
import { chooseSite, rememberedSiteKey } from '../sites/site-choice';

/**
 * Who is signed in, the CSRF token their changes must carry and, on an install of several
 * sites, the site they work at (the role in force is their role there).
 */
@Injectable({ providedIn: 'root' })
export class SessionStore {
  private readonly http = inject(HttpClient);
  /** undefined until the first check; null when nobody is signed in. */
  private readonly session = signal<SessionInfo | null | undefined>(undefined);
  /** The person's sites (empty on a single-site install, which never asks). */
  private readonly siteList = signal<readonly SiteInfo[]>([]);
  private readonly siteKey = signal<string | null>(null);

  /** How many sites the install has: 1 for a single kitchen, which never speaks of sites. */
  readonly siteCount = computed(() => this.session()?.siteCount ?? 1);
  /** The sites the person may work at, with their role at each. */
  readonly sites = this.siteList.asReadonly();
  /** The site the console works at, or undefined on a single-site install. */
  readonly site = computed(() => this.siteList().find((site) => site.key === this.siteKey()));
  /**
   * The signed-in person, or null, with the role in force: their role at the chosen site (the
   * session's role is their role at every site, which another site may override).
   */
  readonly person = computed((): Person | null => {
    const person = this.session()?.person ?? null;
    const site = this.site();
    return person && site ? { ...person, role: site.role } : person;
  });
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
    await this.loadSites();
    return this.person();
  }

  /**
   * Asks for the person's sites when the install has several, and works at the one chosen
   * before in this browser (or the default when that one is gone). Again after a request named
   * a site that is no longer theirs.
   */
  async loadSites(): Promise<void> {
    const person = this.session()?.person;
    if (!person || this.siteCount() <= 1) return this.clearSites();
    const { sites } = await firstValueFrom(this.http.get<SiteList>('/api/sites'));
    this.siteList.set(sites);
    const chosen = chooseSite(sites, readStored(rememberedSiteKey(person.id)));
    this.siteKey.set(chosen?.key ?? null);
  }

  /** Works at another of the person's sites from now on, remembered in this browser. */
  chooseSite(key: string): void {
    const person = this.session()?.person;
    if (!person || !this.siteList().some((site) => site.key === key)) return;
    this.siteKey.set(key);
    try {
      localStorage.setItem(rememberedSiteKey(person.id), key);
    } catch {
      // Storage refused (a private window): the choice holds until the page is reloaded.
    }
  }

  private clearSites(): void {
    this.siteList.set([]);
    this.siteKey.set(null);
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
    await this.loadSites();
    return this.person() ?? session.person;
  }

  /** Signs out on the server and forgets the session here. */
  async signOut(): Promise<void> {
    try {
      await firstValueFrom(this.http.delete<void>('/api/session'));
    } finally {
      this.session.set(null);
      this.clearSites();
    }
  }

  /** Forgets the session without asking the server (it already ended it). */
  forget(): void {
    this.session.set(null);
    this.clearSites();
  }
}

/** A remembered value, or null where storage is refused. */
function readStored(key: string): string | null {
  try {
    return localStorage.getItem(key);
  } catch {
    return null;
  }
}
