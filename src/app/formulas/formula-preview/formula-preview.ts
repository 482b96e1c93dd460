import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import {
  catchError,
  debounceTime,
  distinctUntilChanged,
  map,
  of,
  scan,
  startWith,
  switchMap,
} from 'rxjs';
import { ApiError } from '../../core/api/api-error';
import { messageOf } from '../../core/api/message-of';
import { ResultSheet } from '../../ui/result-sheet/result-sheet';
import type { FormulaKind, PresentedResult, UnitSystem } from '../formula-api-types';
import { FormulaStore } from '../formula-store';
import { problemsOf } from '../formula-problems/problems-of';
import { DEFAULT_SAMPLE, SampleBatch, batchMessage, batchOptions } from './sample-batch';

/** The preview's state: the last sheet stays on screen while the next one is worked out. */
interface PreviewState {
  readonly loading: boolean;
  readonly result: PresentedResult | null;
  /** Why there is no sheet for the latest input. */
  readonly error: string | null;
  /** Whether the error is in the formula (its problems are listed beside the editor). */
  readonly formulaError: boolean;
  /** The formula's errors, when that is why there is no sheet. */
  readonly errors: readonly string[];
  /** Whether a critical limit refuses the formula outright. */
  readonly refused: boolean;
}

const START: PreviewState = {
  loading: false,
  result: null,
  error: null,
  formulaError: false,
  errors: [],
  refused: false,
};

/**
 * A live preview of the draft formula: a sample batch (a few inputs per kind, metric or US units)
 * calculated by the server from the unsaved YAML, about 400 ms after the last change, and shown as
 * a compact batch sheet.
 */
@Component({
  selector: 'app-formula-preview',
  imports: [
    ReactiveFormsModule,
    MatFormField,
    MatLabel,
    MatHint,
    MatInput,
    MatButtonToggleGroup,
    MatButtonToggle,
    MatProgressBar,
    MatIcon,
    ResultSheet,
  ],
  templateUrl: './formula-preview.html',
  styleUrl: './formula-preview.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FormulaPreview {
  private readonly store = inject(FormulaStore);

  /** The formula's id (the preview is asked of it). */
  readonly formulaId = input.required<string>();
  /** The draft YAML to calculate. */
  readonly yaml = input.required<string>();
  /** The formula's kind: decides the sample-batch fields. */
  readonly kind = input.required<FormulaKind>();
  /** A cure's method (a pump cure takes the weight after injecting); null for other kinds. */
  readonly cureMethod = input<string | null>(null);

  protected readonly sample = inject(NonNullableFormBuilder).group<SampleBatch>({
    ...DEFAULT_SAMPLE,
  });
  protected readonly units = signal<UnitSystem>('metric');
  private readonly sampleValue = toSignal(
    this.sample.valueChanges.pipe(map(() => this.sample.getRawValue())),
    { initialValue: this.sample.getRawValue() },
  );
  protected readonly mixBy = computed(() => this.sampleValue().mixBy);
  private readonly request = computed(() => ({
    id: this.formulaId(),
    yaml: this.yaml(),
    batch: batchOptions(this.kind(), this.sampleValue(), this.cureMethod()),
    units: this.units(),
  }));
  protected readonly state = toSignal(
    toObservable(this.request).pipe(
      debounceTime(400),
      distinctUntilChanged((a, b) => JSON.stringify(a) === JSON.stringify(b)),
      switchMap((request) =>
        this.store.preview(request.id, request.yaml, request.batch, request.units).pipe(
          map((preview): Partial<PreviewState> => ({ ...START, result: preview.result })),
          catchError((error: unknown) => of(this.failure(error))),
          startWith<Partial<PreviewState>>({ loading: true }),
        ),
      ),
      scan((last: PreviewState, next: Partial<PreviewState>) => ({ ...last, ...next }), START),
    ),
    { initialValue: { ...START, loading: true } },
  );

  protected chooseUnits(units: UnitSystem): void {
    this.units.set(units);
  }

  private failure(error: unknown): Partial<PreviewState> {
    const problems = problemsOf(error).filter((problem) => problem.severity === 'error');
    if (problems.length > 0) {
      const errors = problems.map((problem) => problem.message);
      // "critical limit exceeded: …" or "critical limit not met: …", as the formula check words them.
      const refused = errors.some((message) => message.startsWith('critical limit '));
      return {
        ...START,
        formulaError: true,
        errors,
        refused,
        error: refused
          ? 'Refused: the formula itself fails a critical limit, so no batch of it may be made.'
          : 'Nothing to calculate until the formula is fixed:',
      };
    }
    return {
      ...START,
      error:
        error instanceof ApiError && error.code === 'bad-batch'
          ? batchMessage(error.message)
          : messageOf(error),
    };
  }
}
