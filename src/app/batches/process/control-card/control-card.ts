import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  signal,
  viewChild,
} from '@angular/core';
import {
  FormControl,
  FormGroup,
  FormGroupDirective,
  ReactiveFormsModule,
  Validators,
} from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { firstValueFrom } from 'rxjs';
import { UnitsTogetherPipe } from '../../../ui/units-together';
import { ControlChart } from '../control-chart/control-chart';
import { CorrectionDialog, type Correction, type CorrectionDialogData } from '../correction-dialog';
import { ProcessStore } from '../process-store';
import type { BatchControl, Reading } from '../process-types';
import {
  STATUS_WORDS,
  clockWords,
  dueWords,
  entryUnit,
  limitWords,
  readingText,
  readingsNewestFirst,
  standingReadings,
  valueWords,
} from '../process-words';
import { earlierTime } from './earlier-time';

/** How many readings are listed before "Show all". */
const SHOWN = 8;

const STATUS_ICONS = {
  waiting: 'hourglass_empty',
  'in-progress': 'pending',
  met: 'check_circle',
  missed: 'error',
} as const;

/** A standing reading with the value it replaced, when it is a correction. */
interface ListedReading {
  readonly reading: Reading;
  readonly replaced: Reading | null;
}

/**
 * One control on the batch page, made for a tablet at the smoker: its title, step and limit in
 * words, where it stands (words and colour), when the next reading is due, a big box and one tap
 * to record a reading (now, or a time taken earlier), the curve of a temperature, and the
 * readings newest first with who and when; a correction keeps the old value struck through.
 */
@Component({
  selector: 'app-control-card',
  imports: [
    ReactiveFormsModule,
    MatFormField,
    MatLabel,
    MatHint,
    MatError,
    MatSuffix,
    MatInput,
    MatButton,
    MatIcon,
    ControlChart,
    UnitsTogetherPipe,
  ],
  templateUrl: './control-card.html',
  styleUrl: './control-card.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ControlCard {
  protected readonly store = inject(ProcessStore);
  private readonly dialog = inject(MatDialog);

  /** The control with its state and readings. */
  readonly control = input.required<BatchControl>();
  /** The moment due times are counted from. */
  readonly now = input.required<Date>();
  /** Whether the signed-in person records readings. */
  readonly canWrite = input(false);
  /** Whether the batch's record is closed (released): no reading is due any more. */
  readonly closed = input(false);

  protected readonly statusWords = STATUS_WORDS;
  protected readonly statusIcons = STATUS_ICONS;
  protected readonly value = new FormControl('', {
    nonNullable: true,
    validators: [Validators.required, Validators.pattern(/\S/)],
  });
  protected readonly time = new FormControl('', { nonNullable: true });
  /** The entry form's group: it makes the form Angular's, so a submit never reloads the page. */
  protected readonly entry = new FormGroup({ value: this.value, time: this.time });
  /** Its directive: resetting it also forgets the submit, so the empty box is not shown in error. */
  private readonly entryForm = viewChild(FormGroupDirective);
  protected readonly earlier = signal(false);
  protected readonly showAll = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly saved = signal<string | null>(null);

  protected readonly c = computed(() => this.control().control);
  protected readonly state = computed(() => this.control().state);
  protected readonly unit = computed(() => entryUnit(this.c().measure));
  protected readonly limit = computed(() => limitWords(this.c().limit, this.c().unit));
  protected readonly due = computed(() =>
    this.closed() ? null : dueWords(this.state().nextDue, this.now()),
  );
  protected readonly overdue = computed(() => {
    const due = this.state().nextDue;
    return !!due && new Date(due).getTime() < this.now().getTime();
  });
  protected readonly isTemperature = computed(() => this.c().measure.endsWith('temperature'));
  protected readonly listed = computed<ListedReading[]>(() => {
    const all = this.control().readings;
    return readingsNewestFirst(standingReadings(all)).map((reading) => ({
      reading,
      replaced: all.find((r) => r.id === reading.corrects) ?? null,
    }));
  });
  protected readonly shown = computed(() =>
    this.showAll() ? this.listed() : this.listed().slice(0, SHOWN),
  );

  protected words(reading: Reading): string {
    return valueWords(reading.value, this.c().unit);
  }

  protected clock(iso: string): string {
    return clockWords(iso, this.now());
  }

  protected async record(): Promise<void> {
    this.saved.set(null);
    if (this.value.invalid) {
      this.value.markAsTouched();
      return;
    }
    let at: string | undefined;
    if (this.earlier() && this.time.value) {
      at = earlierTime(this.time.value, new Date())?.toISOString();
      if (!at) {
        this.problem.set('Enter the time the reading was taken, as on a clock: 14:05.');
        return;
      }
    }
    const text = readingText(this.value.value, this.c().measure);
    const outcome = await this.store.addReading(this.c().id, text, at);
    if (!outcome.ok) {
      this.problem.set(outcome.message);
      return;
    }
    this.problem.set(null);
    this.entryForm()?.resetForm();
    this.earlier.set(false);
    const answer = outcome.value;
    this.saved.set(
      `Recorded ${valueWords(answer.reading.value, this.c().unit)} at ${this.clock(answer.reading.at)}.` +
        (answer.deviation ? ' The limit was missed: the batch is on hold.' : ''),
    );
  }

  protected async correct(reading: Reading): Promise<void> {
    const dialog = this.dialog.open<CorrectionDialog, CorrectionDialogData, Correction>(
      CorrectionDialog,
      {
        data: {
          what: `the reading of ${this.clock(reading.at)}`,
          old: this.words(reading),
          unit: this.unit(),
        },
        width: '520px',
        maxWidth: '95vw',
      },
    );
    const answer = await firstValueFrom(dialog.afterClosed());
    if (!answer) return;
    const outcome = await this.store.correctReading(
      reading.id,
      readingText(answer.value, this.c().measure),
      answer.reason,
    );
    this.problem.set(outcome.ok ? null : outcome.message);
  }
}
