import {
  ChangeDetectionStrategy,
  Component,
  OnInit,
  computed,
  inject,
  signal,
} from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogRef,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { messageOf } from '../../../core/api/message-of';
import { BatchSheet } from '../../../ui/batch-sheet/batch-sheet';
import { DAY_INPUT_IMPORTS, provideDayInputs } from '../../../ui/batch-sheet/day-input-formats';
import { IsoDayPipe, isoDateOf } from '../../../ui/batch-sheet/iso-day-pipe';
import type { Batch, RawBatchOptions } from '../../batch-types';
import { FormulaOptions } from '../../formula-options';
import {
  fieldsFor,
  inBox,
  unitsOf,
  withUnit,
  type BatchField,
} from '../../record-batch/batch-fields';
import { BatchRecorder } from '../../record-batch/batch-recorder';
import type { ProcessStore } from '../process-store';

/** What the start dialog is opened with. */
export interface StartBatchData {
  readonly batch: Batch;
  /** The page's process store: the start is written through it. */
  readonly store: ProcessStore;
}

/** What the dialog closes with once the batch is started: the server's warnings, if any. */
export interface Started {
  readonly warnings: readonly string[];
}

const PREVIEW_DELAY_MS = 400;

/**
 * Starting a planned batch on what is really there: the planned figures filled in, changed to
 * what the scale and the ruler say, the start day (warned when it is not the planned one), the
 * sheet calculated again as you type, then started. The server calculates it once more and
 * refuses a batch over a critical limit.
 */
@Component({
  selector: 'app-start-batch-dialog',
  imports: [
    ReactiveFormsModule,
    MatDialogTitle,
    MatDialogContent,
    MatDialogActions,
    MatDialogClose,
    MatFormField,
    MatLabel,
    MatHint,
    MatSuffix,
    MatInput,
    DAY_INPUT_IMPORTS,
    MatButton,
    MatIcon,
    MatProgressBar,
    BatchSheet,
    IsoDayPipe,
  ],
  providers: [BatchRecorder, provideDayInputs()],
  templateUrl: './start-batch-dialog.html',
  styleUrl: './start-batch-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StartBatchDialog implements OnInit {
  private readonly dialog = inject<MatDialogRef<StartBatchDialog, Started>>(MatDialogRef);
  private readonly formulaOptions = inject(FormulaOptions);
  protected readonly data = inject<StartBatchData>(MAT_DIALOG_DATA);
  protected readonly recorder = inject(BatchRecorder);

  protected readonly fields = signal<readonly BatchField[]>([]);
  protected readonly form = new FormGroup<Record<string, FormControl<string>>>({});
  protected readonly start = new FormControl<Date | null>(new Date());
  /** The start day chosen, YYYY-MM-DD; '' while the box is empty or holds no day. */
  protected readonly startDay = signal(isoDateOf(this.start.value) ?? '');
  protected readonly unitOf = unitsOf(this.data.batch.units === 'us' ? 'us' : 'metric');
  protected readonly problem = signal<string | null>(null);
  protected readonly starting = signal(false);
  /** Whether the start day differs from the plan's. */
  protected readonly moved = computed(() => this.startDay() !== this.data.batch.startedOn);
  private timer: ReturnType<typeof setTimeout> | undefined;

  async ngOnInit(): Promise<void> {
    try {
      const detail = await this.formulaOptions.detail(this.data.batch.formula.id);
      if (!detail.formula) {
        this.problem.set('This formula file has errors; fix it in Formulas before starting.');
        return;
      }
      const fields = fieldsFor(detail.formula);
      const units = this.data.batch.units === 'us' ? 'us' : 'metric';
      for (const field of fields) {
        const planned = this.data.batch.inputs[field.key as keyof RawBatchOptions];
        const text = typeof planned === 'string' ? inBox(planned, field.measure, units) : '';
        this.form.addControl(field.key, new FormControl(text, { nonNullable: true }));
      }
      this.fields.set(fields);
      this.preview();
    } catch (error) {
      this.problem.set(messageOf(error));
    }
  }

  protected changed(): void {
    this.startDay.set(isoDateOf(this.start.value) ?? '');
    clearTimeout(this.timer);
    this.timer = setTimeout(() => this.preview(), PREVIEW_DELAY_MS);
  }

  protected async confirm(): Promise<void> {
    clearTimeout(this.timer);
    if (this.starting()) return;
    this.starting.set(true);
    const outcome = await this.data.store.start(this.options());
    this.starting.set(false);
    if (!outcome.ok) {
      this.problem.set(outcome.message);
      return;
    }
    this.dialog.close({ warnings: outcome.value.warnings ?? [] });
  }

  private preview(): void {
    void this.recorder.calculate(
      this.data.batch.formula.id,
      this.options(),
      this.data.batch.units === 'us' ? 'us' : 'metric',
    );
  }

  /** The planned options, with what was typed in their place and the start day chosen. */
  private options(): RawBatchOptions {
    const units = this.data.batch.units === 'us' ? 'us' : 'metric';
    const options: Record<string, string> = {};
    for (const [key, value] of Object.entries(this.data.batch.inputs))
      if (typeof value === 'string') options[key] = value;
    for (const field of this.fields()) {
      const typed = this.form.controls[field.key]?.value.trim() ?? '';
      if (typed === '') delete options[field.key];
      else options[field.key] = withUnit(typed, field.measure, units);
    }
    const start = isoDateOf(this.start.value);
    if (start) options['start'] = start;
    return options as RawBatchOptions;
  }
}
