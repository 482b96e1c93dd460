import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { MyChoices, ReminderSettings } from './reminder-choices';

/** The signed-in person's own account, whatever their role: their password and reminders. */
@Injectable({ providedIn: 'root' })
export class AccountStore {
  private readonly http = inject(HttpClient);

  /** Changes the signed-in person's own password; rejects with an ApiError (403 when `current` is wrong). */
  async changeOwnPassword(current: string, password: string): Promise<void> {
    await firstValueFrom(this.http.put<void>('/api/people/me/password', { current, password }));
  }

  /** The signed-in person's own reminder choices and the address they go to. */
  async myReminders(): Promise<ReminderSettings> {
    return firstValueFrom(this.http.get<ReminderSettings>('/api/people/me/reminders'));
  }

  /** Stores the signed-in person's own reminder choices; answers with them as the server keeps them. */
  async saveMyReminders(choices: MyChoices): Promise<ReminderSettings> {
    return firstValueFrom(this.http.put<ReminderSettings>('/api/people/me/reminders', choices));
  }
}
