import {
  ChangeDetectionStrategy,
  Component,
  OnInit,
  computed,
  inject,
  signal,
} from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import {
  MatDialog,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogRef,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { map } from 'rxjs';
import { messageOf } from '../../core/api/message-of';
import { AccountStore } from '../account-store';
import {
  MyChoices,
  REMINDER_OPTIONS,
  ReminderSettings,
  choicesText,
  sameChoices,
} from '../reminder-choices';

/**
 * Lets whoever is signed in, whatever their role, choose which reminders they get by e-mail
 * (turn days, ready days, overdue batches), and shows the address they go to. Closes with `true`
 * once the choices are saved.
 */
@Component({
  selector: 'app-my-reminders',
  imports: [
    ReactiveFormsModule,
    MatDialogTitle,
    MatDialogContent,
    MatDialogActions,
    MatDialogClose,
    MatCheckbox,
    MatButton,
    MatIcon,
    MatProgressBar,
  ],
  templateUrl: './my-reminders.html',
  styleUrl: './my-reminders.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MyReminders implements OnInit {
  private readonly store = inject(AccountStore);

  protected readonly options = REMINDER_OPTIONS;
  protected readonly summary = choicesText;
  protected readonly form = inject(NonNullableFormBuilder).group({
    flip: false,
    ready: false,
    overdue: false,
    processAlerts: false,
  });
  private readonly choices = toSignal(
    this.form.valueChanges.pipe(map((): MyChoices => this.form.getRawValue())),
    { initialValue: this.form.getRawValue() },
  );
  /** The choices and address as the server last answered. */
  protected readonly mine = signal<ReminderSettings | null>(null);
  /** What is going on: loading the choices, or saving them; null when nothing. */
  private readonly activity = signal<'loading' | 'saving' | null>(null);
  protected readonly busy = computed(() => this.activity() !== null);
  protected readonly busyLabel = computed(() =>
    this.activity() === 'saving' ? 'Saving your choices' : 'Loading your choices',
  );
  protected readonly failure = signal<string | null>(null);
  /** The choices once saved: the dialog then says so. */
  protected readonly saved = signal<ReminderSettings | null>(null);
  /** Whether the form shows the role's defaults. */
  protected readonly isDefault = computed(() => {
    const defaults = this.mine()?.defaults;
    const mine = this.mine();
    return (
      defaults !== undefined &&
      sameChoices(this.choices(), defaults) &&
      this.choices().processAlerts === mine?.processAlertsDefault
    );
  });

  ngOnInit(): void {
    void this.load();
  }

  protected async load(): Promise<void> {
    this.activity.set('loading');
    this.failure.set(null);
    try {
      const mine = await this.store.myReminders();
      this.form.setValue({ ...mine.choices, processAlerts: mine.processAlerts });
      this.mine.set(mine);
    } catch (error) {
      this.failure.set(messageOf(error, 'Your reminder choices could not be loaded.', 'sentence'));
    } finally {
      this.activity.set(null);
    }
  }

  protected useDefaults(): void {
    const mine = this.mine();
    if (mine) this.form.setValue({ ...mine.defaults, processAlerts: mine.processAlertsDefault });
  }

  protected async save(): Promise<void> {
    if (this.busy() || !this.mine()) return;
    this.activity.set('saving');
    this.failure.set(null);
    try {
      this.saved.set(await this.store.saveMyReminders(this.form.getRawValue()));
    } catch (error) {
      this.failure.set(messageOf(error, 'Your choices could not be saved; try again.', 'sentence'));
    } finally {
      this.activity.set(null);
    }
  }
}

/**
 * Opens the "My reminders" dialog.
 * @param dialog The MatDialog of the caller (the shell's account menu).
 * @returns The dialog; it closes with `true` once the choices are saved.
 */
export function openMyReminders(dialog: MatDialog): MatDialogRef<MyReminders, boolean> {
  return dialog.open<MyReminders, void, boolean>(MyReminders, {
    width: '520px',
    maxWidth: '95vw',
  });
}
