import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { Person, Role } from '../core/api/api-types';
import { messageOf } from '../core/api/message-of';
import { InvitationSent } from './invitation-sent';

/** What an admin fills in to add a person; without a password the server makes one up. */
export interface NewPerson {
  readonly username: string;
  readonly displayName: string;
  readonly email: string | null;
  readonly role: Role;
  /** The one site the role holds at; without it, every site. */
  readonly site?: string;
  readonly password?: string;
}

/** What an admin may change about a person (PATCH /api/people/:id). */
export type PersonChanges = Partial<
  Pick<Person, 'displayName' | 'email' | 'role' | 'active' | 'roleEverywhere' | 'sites'>
>;

/**
 * A person just added, with the password the server made up for them (null when one was given)
 * and the invitation sent to their address (null without one).
 */
export interface AddedPerson {
  readonly person: Person;
  readonly password: string | null;
  readonly invitation: InvitationSent | null;
}

interface PeopleState {
  readonly people: readonly Person[];
  readonly loading: boolean;
  readonly failure: string | null;
  /** Whether the list has come back from the server at least once. */
  readonly loaded: boolean;
}

/** The people of the kitchen, for admins: the list, and every change to it through the API. */
@Injectable({ providedIn: 'root' })
export class PeopleStore {
  private readonly http = inject(HttpClient);
  private readonly state = signal<PeopleState>({
    people: [],
    loading: false,
    failure: null,
    loaded: false,
  });

  /** Everyone, active people first, as the server orders them. */
  readonly people = computed(() => this.state().people);
  /** Whether the list is being fetched. */
  readonly loading = computed(() => this.state().loading);
  /** Why the list could not be fetched, or null. */
  readonly failure = computed(() => this.state().failure);
  /** Whether the list has been fetched at least once. */
  readonly loaded = computed(() => this.state().loaded);

  /** Fetches the list again; a failure is kept in `failure`, never thrown. */
  async load(): Promise<void> {
    this.state.update((state) => ({ ...state, loading: true, failure: null }));
    try {
      const { people } = await firstValueFrom(this.http.get<{ people: Person[] }>('/api/people'));
      this.state.set({ people, loading: false, failure: null, loaded: true });
    } catch (error) {
      const failure = messageOf(error, 'The list of people could not be loaded.', 'sentence');
      this.state.update((state) => ({ ...state, loading: false, failure }));
    }
  }

  /**
   * Adds a person. Rejects with an ApiError (409 when the username is taken).
   * @returns The person, the generated password when none was given (it is shown only once), and
   *   the invitation that went to their address, if they have one.
   */
  async add(draft: NewPerson): Promise<AddedPerson> {
    const answer = await firstValueFrom(
      this.http.post<{ person: Person; password?: string; invitation?: InvitationSent | null }>(
        '/api/people',
        draft,
      ),
    );
    this.state.update((state) => ({
      ...state,
      people: sortPeople([...state.people, answer.person]),
    }));
    return {
      person: answer.person,
      password: answer.password ?? null,
      invitation: answer.invitation ?? null,
    };
  }

  /**
   * Sends a person a new invitation to set their password; the link of any older one stops
   * working. Rejects with an ApiError (409 without an address, or for a deactivated person).
   */
  async resendInvitation(id: number): Promise<InvitationSent> {
    const { invitation } = await firstValueFrom(
      this.http.post<{ invitation: InvitationSent }>(`/api/people/${id}/invitation`, {}),
    );
    return invitation;
  }

  /**
   * Changes name, e-mail, role or whether a person is active. Rejects with an ApiError (409 when
   * it would leave no active admin).
   */
  async change(id: number, changes: PersonChanges): Promise<Person> {
    const { person } = await firstValueFrom(
      this.http.patch<{ person: Person }>(`/api/people/${id}`, changes),
    );
    // Changed in place, so the row an admin just acted on does not jump away from under them.
    this.state.update((state) => ({
      ...state,
      people: state.people.map((p) => (p.id === person.id ? person : p)),
    }));
    return person;
  }

  /**
   * Gives a person a new password made up by the server.
   * @returns The new password: it is shown only once.
   */
  async resetPassword(id: number): Promise<string> {
    const { password } = await firstValueFrom(
      this.http.post<{ password: string }>(`/api/people/${id}/password`, {}),
    );
    return password;
  }
}

// The server's order: active first, then by display name.
function sortPeople(people: readonly Person[]): Person[] {
  return [...people].sort(
    (a, b) =>
      Number(b.active) - Number(a.active) ||
      a.displayName.localeCompare(b.displayName) ||
      a.id - b.id,
  );
}
