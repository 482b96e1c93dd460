import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';

import { MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import {
  catchError,
  debounceTime,
  distinctUntilChanged,
  from,
  map,
  of,
  scan,
  startWith,
  switchMap,
} from 'rxjs';
import { DAY_INPUT_IMPORTS, provideDayInputs } from '../../ui/batch-sheet/day-input-formats';
import { isoDateOf, localDateOf } from '../../ui/batch-sheet/iso-day-pipe';
import { PlanApi } from '../../plans/plan-api';
import { MAX_COUNT, addDays, paramsOfPlan } from '../../plans/plan-query';
import { refusalOf, type PlanRefusalView } from '../../plans/plan-refusal';
import { PlanSchedule } from '../../plans/plan-schedule/plan-schedule';
import type { PlanRequest, PresentedPlan } from '../../plans/plan-types';

/** How many units and how far ahead the preview plans, unless changed. */
const SAMPLE_COUNT = 10;
const SAMPLE_DAYS_AHEAD = 14;

/** The preview's state: the last plan stays on screen while the next one is worked out. */
interface PreviewState {
  readonly loading: boolean;
  readonly plan: PresentedPlan | null;
  readonly refusal: PlanRefusalView | null;
}

const START: PreviewState = { loading: false, plan: null, refusal: null };

/**
 * The live preview of an assembly: a small plan of the saved assembly (10 units, two weeks
 * ahead, both changeable) as a schedule with its allergens, and a link to the full plan on the
 * Plans page. An assembly is planned, never calculated as one batch.
 */
@Component({
  selector: 'app-assembly-preview',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatFormField,
    MatLabel,
    MatHint,
    MatSuffix,
    MatInput,
    DAY_INPUT_IMPORTS,
    MatIcon,
    MatProgressBar,
    PlanSchedule,
  ],
  providers: [provideDayInputs()],
  templateUrl: './assembly-preview.html',
  styleUrl: './assembly-preview.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AssemblyPreview {
  private readonly api = inject(PlanApi);

  /** The assembly's id. */
  readonly formulaId = input.required<string>();
  /** The saved revision: the preview is planned again when it changes. */
  readonly revision = input.required<string>();
  /** Whether the draft has changes that are not saved (the preview plans the saved assembly). */
  readonly unsaved = input(false);

  protected readonly sample = inject(NonNullableFormBuilder).group({
    count: [
      SAMPLE_COUNT as number | null,
      [Validators.required, Validators.min(1), Validators.max(MAX_COUNT)],
    ],
    for: [
      localDateOf(addDays(isoDateOf(new Date()) as string, SAMPLE_DAYS_AHEAD)) as Date | null,
      Validators.required,
    ],
  });
  private readonly sampleValue = toSignal(
    this.sample.valueChanges.pipe(map(() => this.sample.getRawValue())),
    { initialValue: this.sample.getRawValue() },
  );
  /** The plan asked for, or null while the sample cannot be used. */
  private readonly request = computed((): (PlanRequest & { revision: string }) | null => {
    const { count, for: date } = this.sampleValue();
    const day = isoDateOf(date);
    if (count === null || !Number.isInteger(count) || count < 1 || day === null) return null;
    return { assembly: this.formulaId(), count, for: day, revision: this.revision() };
  });
  /** The Plans page with this sample, for the full plan. */
  protected readonly plansLink = computed(() => {
    const request = this.request();
    return paramsOfPlan({
      assembly: this.formulaId(),
      count: request?.count ?? null,
      for: request?.for ?? null,
      units: 'metric',
    });
  });
  protected readonly state = toSignal(
    toObservable(this.request).pipe(
      debounceTime(400),
      distinctUntilChanged((a, b) => JSON.stringify(a) === JSON.stringify(b)),
      switchMap((request) => {
        if (!request) return of<Partial<PreviewState>>(START);
        const { revision: _revision, ...body } = request;
        return from(this.api.plan(body)).pipe(
          map((plan): Partial<PreviewState> => ({ ...START, plan })),
          catchError((error: unknown) => of({ ...START, refusal: refusalOf(error) })),
          startWith<Partial<PreviewState>>({ loading: true }),
        );
      }),
      scan((last: PreviewState, next: Partial<PreviewState>) => ({ ...last, ...next }), START),
    ),
    { initialValue: { ...START, loading: true } },
  );
}
