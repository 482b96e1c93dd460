import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogRef,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatProgressBar } from '@angular/material/progress-bar';
import { Person } from '../../core/api/api-types';
import { messageOf } from '../../core/api/message-of';
import { SessionStore } from '../../core/auth/session-store';
import { PeopleStore } from '../people-store';

/** Asks before deactivating or reactivating a person, then does it. Closes with the changed person. */
@Component({
  selector: 'app-person-status-dialog',
  imports: [
    MatDialogTitle,
    MatDialogContent,
    MatDialogActions,
    MatDialogClose,
    MatButton,
    MatProgressBar,
  ],
  templateUrl: './person-status-dialog.html',
  styleUrl: './person-status-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PersonStatusDialog {
  private readonly store = inject(PeopleStore);
  private readonly dialogRef = inject<MatDialogRef<PersonStatusDialog, Person>>(MatDialogRef);

  /** The person as the list showed them. */
  protected readonly person = inject<Person>(MAT_DIALOG_DATA);
  protected readonly isSelf = inject(SessionStore).person()?.id === this.person.id;
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected async switchActive(): Promise<void> {
    if (this.busy()) return;
    this.busy.set(true);
    this.failure.set(null);
    try {
      this.dialogRef.close(
        await this.store.change(this.person.id, { active: !this.person.active }),
      );
    } catch (error) {
      this.failure.set(messageOf(error, 'That did not work; try again.', 'sentence'));
    } finally {
      this.busy.set(false);
    }
  }
}
