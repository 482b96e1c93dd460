import { HttpClient } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import {
  InvitationAccepted,
  InvitationInfo,
  InvitationRefusal,
  invitationRefusal,
  linkRefused,
} from './invitation';

/** Where the set-password page is with its link. */
export type InvitationView =
  | { readonly step: 'checking' }
  | { readonly step: 'valid'; readonly invitation: InvitationInfo }
  | { readonly step: 'refused'; readonly refusal: InvitationRefusal };

/**
 * One invitation link, for the public set-password page: whether it works and for whom, and
 * setting the password with it. No sign-in: the token in the link is the proof. Provided by the
 * page, so every visit starts afresh.
 */
@Injectable()
export class InvitationStore {
  private readonly http = inject(HttpClient);
  private readonly state = signal<InvitationView>({ step: 'checking' });
  private token = '';

  /** Where the page is: checking the link, a link that works, or a refused one. */
  readonly view = this.state.asReadonly();

  /** Asks the server whether a link's token works; a refusal is kept in `view`, never thrown. */
  async check(token: string | undefined): Promise<void> {
    this.token = token?.trim() ?? '';
    if (this.token === '') {
      this.state.set({ step: 'refused', refusal: invitationRefusal('no-token') });
      return;
    }
    this.state.set({ step: 'checking' });
    try {
      const invitation = await firstValueFrom(
        this.http.get<InvitationInfo>(`/api/invitations/${encodeURIComponent(this.token)}`),
      );
      this.state.set({ step: 'valid', invitation });
    } catch (error) {
      this.state.set({ step: 'refused', refusal: invitationRefusal(error) });
    }
  }

  /**
   * Sets the password with the link.
   * @returns Whose password it set; null when the link no longer works (`view` then says why).
   * @throws ApiError for a failure that trying again may mend (a refused password, no connection).
   */
  async accept(password: string): Promise<InvitationAccepted | null> {
    try {
      return await firstValueFrom(
        this.http.post<InvitationAccepted>(`/api/invitations/${encodeURIComponent(this.token)}`, {
          password,
        }),
      );
    } catch (error) {
      if (!linkRefused(error)) throw error;
      this.state.set({ step: 'refused', refusal: invitationRefusal(error) });
      return null;
    }
  }
}
