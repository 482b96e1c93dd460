import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  OnInit,
  computed,
  inject,
  input,
  signal,
} from '@angular/core';
import {
  FormArray,
  FormControl,
  FormGroup,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
  type AbstractControl,
} from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { ErrorStateMatcher, MatOption } from '@angular/material/core';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSelect } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import type { HoldSize } from '../../../../shared/calculation/cure/hold-size.ts';
import { messageOf } from '../../core/api/message-of';
import { BatchSheet } from '../../ui/batch-sheet/batch-sheet';
import { DAY_INPUT_IMPORTS, provideDayInputs } from '../../ui/batch-sheet/day-input-formats';
import { isoDateOf } from '../../ui/batch-sheet/iso-day-pipe';
import { BatchLog } from '../batch-log/batch-log';
import type { FormulaFacts } from '../batch-types';
import { FormulaOptions } from '../formula-options';
import {
  FIELD_KEYS,
  batchOptions,
  fieldOf,
  fieldsFor,
  inFormWords,
  unitsOf,
  type FieldKey,
  type Units,
} from './batch-fields';
import { BatchRecorder } from './batch-recorder';

/** The boxes of each blend trimming: the weight on hand and a fat test measured today. */
const TRIMMING_BOXES = [
  { control: 'onHand', label: 'On hand', measure: 'mass', testId: 'record-on-hand-' },
  { control: 'fatTest', label: 'Fat test', measure: 'percent', testId: 'record-fat-test-' },
] as const;

const PREVIEW_DELAY_MS = 400;

/** Shows a box's error as soon as it has been typed in, not only after leaving it. */
const SHOW_WHEN_TYPED: ErrorStateMatcher = {
  isErrorState: (control: AbstractControl | null) =>
    !!control && control.invalid && (control.dirty || control.touched),
};

/**
 * Records a batch: choose a formula, enter what the batch takes, watch the batch sheet as you
 * type, then record it. A cure over its critical limit is refused with the reasons on screen and
 * nothing is recorded; a recorded batch opens on its own page.
 */
@Component({
  selector: 'app-record-batch-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatFormField,
    MatLabel,
    MatHint,
    MatError,
    MatSuffix,
    MatInput,
    MatSelect,
    MatOption,
    MatButton,
    MatIconButton,
    MatIcon,
    MatProgressBar,
    DAY_INPUT_IMPORTS,
    BatchSheet,
  ],
  providers: [
    BatchRecorder,
    provideDayInputs(),
    { provide: ErrorStateMatcher, useValue: SHOW_WHEN_TYPED },
  ],
  templateUrl: './record-batch-page.html',
  styleUrl: './record-batch-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class RecordBatchPage implements OnInit {
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly router = inject(Router);
  private readonly log = inject(BatchLog);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  protected readonly recorder = inject(BatchRecorder);
  protected readonly formulaOptions = inject(FormulaOptions);

  /** A formula to start with (?formula=id, from a formula's page). */
  readonly formula = input<string>();

  protected readonly form = this.fb.group({
    formula: this.fb.control<string | null>(null, Validators.required),
    values: new FormGroup(
      Object.fromEntries(
        FIELD_KEYS.map((key) => [key, new FormControl('', { nonNullable: true })]),
      ) as Record<FieldKey, FormControl<string>>,
    ),
    // A blend's trimmings, in the formula's order: what is on hand, and a fat test measured today.
    trimmings: new FormArray<
      FormGroup<{ onHand: FormControl<string>; fatTest: FormControl<string> }>
    >([]),
    start: this.fb.control<Date | null>(new Date()),
    units: this.fb.control<Units>('metric'),
    status: this.fb.control<'in-progress' | 'planned' | 'done'>('in-progress'),
    notes: this.fb.control('', Validators.maxLength(2000)),
  });
  protected readonly trimmingBoxes = TRIMMING_BOXES;
  protected readonly facts = signal<FormulaFacts | null>(null);
  protected readonly factsError = signal<string | null>(null);
  protected readonly units = signal<Units>('metric');
  /** The unit a bare number in each kind of box is taken in. */
  protected readonly unitOf = computed(() => unitsOf(this.units()));
  /** The size this cure's hold goes by, once a preview or the server has said it is missing. */
  private readonly neededSize = signal<HoldSize | null>(null);
  protected readonly fields = computed(() => {
    const facts = this.facts();
    return facts ? fieldsFor(facts, this.neededSize()) : [];
  });
  /** The preview with its warnings in the form's words: a box's label, never an option's name. */
  protected readonly previewShown = computed(() => {
    const result = this.recorder.preview();
    if (!result) return null;
    const fields = this.fields();
    return { ...result, warnings: result.warnings.map((w) => inFormWords(w, fields)) };
  });
  /** The words of the latest input problem, with boxes named as the form names them. */
  protected readonly problemText = computed(() => {
    const problem = this.recorder.inputProblem();
    return problem ? inFormWords(problem.message, this.fields()) : null;
  });
  /** Whether the latest input problem is shown on the box it is about. */
  protected readonly problemOnField = signal(false);
  private previewTimer: ReturnType<typeof setTimeout> | undefined;

  ngOnInit(): void {
    void this.formulaOptions.load();
    const id = this.formula();
    if (id) {
      this.form.controls.formula.setValue(id);
      void this.chooseFormula();
    }
  }

  protected async chooseFormula(): Promise<void> {
    const id = this.form.controls.formula.value;
    this.recorder.clear();
    this.facts.set(null);
    this.neededSize.set(null);
    this.factsError.set(null);
    this.form.controls.values.reset();
    if (!id) return;
    try {
      const detail = await this.formulaOptions.detail(id);
      if (this.form.controls.formula.value !== id) return;
      if (!detail.formula) {
        this.factsError.set('This formula file has errors; fix it in Formulas before using it.');
        return;
      }
      this.facts.set(detail.formula);
      this.statusForKind(detail.formula.kind);
      const trimmings = this.form.controls.trimmings;
      trimmings.clear();
      for (const _ of detail.formula.components ?? []) {
        trimmings.push(this.fb.group({ onHand: '', fatTest: '' }));
      }
      this.previewNow();
    } catch (error) {
      this.factsError.set(messageOf(error));
    }
  }

  /**
   * An assembly is put together in one go, so it is made (done) on its day unless planned; any
   * other batch starts in progress. A planned choice stays as it is.
   */
  private statusForKind(kind: FormulaFacts['kind']): void {
    const status = this.form.controls.status;
    if (kind === 'assembly' && status.value === 'in-progress') status.setValue('done');
    if (kind !== 'assembly' && status.value === 'done') status.setValue('in-progress');
  }

  protected chooseUnits(): void {
    this.units.set(this.form.controls.units.value);
    this.previewNow();
  }

  /** Waits for a pause in typing, then calculates the preview. */
  protected schedulePreview(): void {
    clearTimeout(this.previewTimer);
    this.previewTimer = setTimeout(() => this.previewNow(), PREVIEW_DELAY_MS);
  }

  protected async record(): Promise<void> {
    clearTimeout(this.previewTimer);
    const id = this.form.controls.formula.value;
    if (this.form.invalid || !id || !this.facts()) {
      this.form.markAllAsTouched();
      this.focusFirstMissing();
      return;
    }
    const raw = this.form.getRawValue();
    const batch = await this.recorder.record({
      formula: id,
      batch: this.options(),
      units: raw.units,
      status: raw.status,
      ...(raw.notes.trim() ? { notes: raw.notes.trim() } : {}),
    });
    if (batch) {
      this.log.invalidate();
      // Straight on to what it was made from: the batch page opens at its lots.
      await this.router.navigate(['/batches', batch.lotCode], { fragment: 'made-from' });
    } else {
      this.markProblemField();
    }
  }

  private previewNow(): void {
    clearTimeout(this.previewTimer);
    const id = this.form.controls.formula.value;
    if (!id || !this.facts()) return;
    // Nothing typed yet: there is no batch to calculate, and nothing to complain about.
    const trimmingsTyped = this.form.controls.trimmings.controls.some(
      (t) => t.controls.onHand.value.trim() !== '' || t.controls.fatTest.value.trim() !== '',
    );
    if (
      !trimmingsTyped &&
      FIELD_KEYS.every((key) => this.form.controls.values.controls[key].value.trim() === '')
    ) {
      this.recorder.clear();
      return;
    }
    void this.recorder.calculate(id, this.options(), this.form.controls.units.value).then(() => {
      const needs = this.recorder.preview()?.holdNeeds;
      if (needs) this.neededSize.set(needs);
      this.markProblemField();
    });
  }

  /** Whether a box must be filled in before recording: a size the hold goes by, for a batch made now. */
  protected isRequired(field: { readonly required?: boolean }): boolean {
    return !!field.required && this.form.controls.status.value !== 'planned';
  }

  /** Puts the cursor in the first box that stops the record: the formula, or a missing size. */
  private focusFirstMissing(): void {
    const missing = this.form.controls.formula.invalid
      ? 'record-formula'
      : this.fields().find((field) => this.form.controls.values.controls[field.key].invalid)?.key;
    if (!missing) return;
    const testId = missing === 'record-formula' ? missing : `record-field-${missing}`;
    this.host.nativeElement.querySelector<HTMLElement>(`[data-testid="${testId}"]`)?.focus();
  }

  private options(): ReturnType<typeof batchOptions> {
    const raw = this.form.getRawValue();
    const components = this.facts()?.components ?? [];
    const trimmings = raw.trimmings.map((values, i) => ({
      key: components[i]?.key ?? '',
      ...values,
    }));
    return batchOptions(this.fields(), raw.values, raw.units, trimmings, isoDateOf(raw.start));
  }

  /** Puts the API's complaint on the box it is about, when that box has been typed in. */
  private markProblemField(): void {
    const problem = this.recorder.inputProblem();
    const key = problem ? fieldOf(problem.details) : null;
    // The server asks for a size the form did not know the hold goes by: offer it, and ask.
    const sizeNeeded = problem?.code === 'hold-size-needed';
    if (sizeNeeded && (key === 'thickness' || key === 'largestPiece')) this.neededSize.set(key);
    let onField = false;
    for (const field of FIELD_KEYS) {
      const control = this.form.controls.values.controls[field];
      if (field === key && (sizeNeeded || control.value.trim() !== '')) {
        control.setErrors({ server: this.problemText() });
        control.markAsTouched();
        onField = true;
      } else if (control.hasError('server')) control.setErrors(null);
    }
    this.problemOnField.set(onField);
    if (sizeNeeded) setTimeout(() => this.focusFirstMissing());
  }
}
