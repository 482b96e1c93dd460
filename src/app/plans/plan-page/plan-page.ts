import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  untracked,
} from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatOption } from '@angular/material/core';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSelect } from '@angular/material/select';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { map } from 'rxjs';
import { SessionStore } from '../../core/auth/session-store';
import { DAY_INPUT_IMPORTS, provideDayInputs } from '../../ui/batch-sheet/day-input-formats';
import { IsoDayPipe, isoDateOf, localDateOf } from '../../ui/batch-sheet/iso-day-pipe';
import {
  MAX_COUNT,
  addDays,
  paramsOfPlan,
  planQueryFrom,
  requestOf,
  type PlanQuery,
} from '../plan-query';
import { PlanStore } from '../plan-store';
import type { PlanUnits } from '../plan-types';
import { PlanList } from '../plan-list/plan-list';
import { PlannedBatches } from '../planned-batches/planned-batches';
import { PlanView } from '../plan-view/plan-view';

/** Days from today the service day is set to when the address does not give one. */
const DEFAULT_DAYS_AHEAD = 7;

/** Today on this device, YYYY-MM-DD. */
const todayIso = (): string => isoDateOf(new Date()) as string;

/**
 * Plans a menu item: choose an assembly, how many to serve and the day of service; the plan
 * shows every batch with its start day and quantities, the pull list, the allergens, warnings
 * and cautions. Admins and cooks record its batches as planned; anyone downloads its production
 * sheets as a PDF. The plan lives in the address (?assembly=…&count=…&for=…), so it can be linked.
 */
@Component({
  selector: 'app-plan-page',
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
    MatIcon,
    MatProgressBar,
    DAY_INPUT_IMPORTS,
    IsoDayPipe,
    PlanView,
    PlanList,
    PlannedBatches,
  ],
  providers: [PlanStore, provideDayInputs()],
  templateUrl: './plan-page.html',
  styleUrl: './plan-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class PlanPage {
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly session = inject(SessionStore);
  protected readonly store = inject(PlanStore);

  protected readonly maxCount = MAX_COUNT;
  /** The first day a plan can be for (the date picker's minimum). */
  protected readonly today = localDateOf(todayIso());
  protected readonly form = inject(NonNullableFormBuilder).group({
    assembly: [null as string | null, Validators.required],
    count: [
      null as number | null,
      [
        Validators.required,
        Validators.min(1),
        Validators.max(MAX_COUNT),
        Validators.pattern(/^\d+$/),
      ],
    ],
    for: [null as Date | null, Validators.required],
    units: ['metric' as PlanUnits],
  });
  /** The plan the address asks for. */
  private readonly query = toSignal(
    this.route.queryParamMap.pipe(
      map((params) =>
        planQueryFrom(Object.fromEntries(params.keys.map((key) => [key, params.get(key) ?? '']))),
      ),
    ),
    { requireSync: true },
  );
  /** Whether the signed-in person may record batches. */
  protected readonly canRecord = computed(() => this.session.hasRole('admin', 'cook'));
  /** The title of the assembly chosen in the address, for the empty state. */
  protected readonly chosenTitle = computed(() => {
    const id = this.query().assembly;
    return this.store.assemblies()?.find((option) => option.id === id)?.title ?? id;
  });

  constructor() {
    void this.store.loadAssemblies();
    void this.store.loadPlans();
    effect(() => {
      const query = this.query();
      untracked(() => this.follow(query));
    });
  }

  /** Shows the plan of the form, by putting it in the address (a linkable plan). */
  protected async submit(): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const raw = this.form.getRawValue();
    const query: PlanQuery = {
      assembly: raw.assembly,
      count: raw.count,
      for: isoDateOf(raw.for),
      units: raw.units,
    };
    const params = paramsOfPlan(query);
    const same = JSON.stringify(paramsOfPlan(this.query())) === JSON.stringify(params);
    if (same) {
      // The address already says so: work it out again (the formulas may have changed).
      const request = requestOf(query);
      if (request) await this.store.show(request);
      return;
    }
    await this.router.navigate([], { relativeTo: this.route, queryParams: params });
  }

  /** Another unit system for a plan on screen: show it again in those units. */
  protected chooseUnits(): void {
    if (this.store.current()) void this.submit();
  }

  /** The form shows what the address asks for, and the plan is worked out when it is complete. */
  private follow(query: PlanQuery): void {
    this.form.patchValue({
      assembly: query.assembly,
      count: query.count,
      for: localDateOf(query.for ?? addDays(todayIso(), DEFAULT_DAYS_AHEAD)),
      units: query.units,
    });
    const request = requestOf(query);
    if (request) void this.store.show(request);
    else this.store.clear();
  }
}
