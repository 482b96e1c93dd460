import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  output,
} from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';

import {
  MatDatepickerToggle,
  MatDateRangeInput,
  MatDateRangePicker,
  MatEndDate,
  MatStartDate,
} from '@angular/material/datepicker';
import { MatFormField, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { BATCH_STATUSES, statusInWords } from '../../../../shared/workflow/batch-status.ts';
import { provideDayInputs } from '../../ui/batch-sheet/day-input-formats';
import { isoDateOf, localDateOf } from '../../ui/batch-sheet/iso-day-pipe';
import type { BatchStatus, FormulaKind, PersonRef } from '../batch-types';
import type { FormulaOption } from '../formula-options';
import { FORMULA_KIND_WORDS } from '../formula-kind-words';
import { isFiltered, type LogQuery } from './log-query';

/** The operator select's value: a person's id, "another id" typed by hand, or anyone. */
type OperatorChoice = number | 'other' | null;

/** The filters of the batch log, as a change to the view. */
export type FilterChange = Partial<
  Pick<LogQuery, 'formula' | 'kind' | 'statuses' | 'operator' | 'from' | 'to' | 'lot' | 'show'>
>;

const LOT_DELAY_MS = 350;

/**
 * The batch log's filters: formula, kind, status, operator, recorded between, lot code. Shows the
 * view it is given and reports each change; the page keeps the view in the address bar.
 */
@Component({
  selector: 'app-batch-filters',
  imports: [
    ReactiveFormsModule,
    MatFormField,
    MatLabel,
    MatSuffix,
    MatSelect,
    MatOption,
    MatInput,
    MatButton,
    MatIcon,
    MatDateRangeInput,
    MatStartDate,
    MatEndDate,
    MatDateRangePicker,
    MatDatepickerToggle,
  ],
  providers: [provideDayInputs()],
  templateUrl: './batch-filters.html',
  styleUrl: './batch-filters.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BatchFilters {
  private readonly fb = inject(NonNullableFormBuilder);

  /** The view whose filters are shown. */
  readonly query = input.required<LogQuery>();
  /** Formulas to filter by. */
  readonly formulas = input.required<readonly FormulaOption[]>();
  /** People seen as operators so far. */
  readonly operators = input.required<readonly PersonRef[]>();
  /** A filter changed. */
  readonly filtersChange = output<FilterChange>();

  protected readonly statuses = BATCH_STATUSES.map((status) => ({
    value: status,
    words: statusInWords(status),
  }));
  protected readonly kinds = (Object.entries(FORMULA_KIND_WORDS) as [FormulaKind, string][]).map(
    ([value, words]) => ({ value, words }),
  );
  protected readonly form = this.fb.group({
    formula: this.fb.control<string | null>(null),
    kind: this.fb.control<FormulaKind | null>(null),
    statuses: this.fb.control<BatchStatus[]>([]),
    operator: this.fb.control<OperatorChoice>(null),
    operatorId: this.fb.control(''),
    from: this.fb.control<Date | null>(null),
    to: this.fb.control<Date | null>(null),
    lot: this.fb.control(''),
  });
  /** Whether any filter narrows the log. */
  protected readonly filtered = computed(() => isFiltered(this.query()));
  /** The view's formula when it is not listed (renamed, or a typed link), to show it anyway. */
  protected readonly unlistedFormula = computed(() => {
    const id = this.query().formula;
    return id !== null && !this.formulas().some((f) => f.id === id) ? id : null;
  });
  private lotTimer: ReturnType<typeof setTimeout> | undefined;

  constructor() {
    effect(() => this.showQuery(this.query(), this.operators()));
  }

  protected applyFormula(): void {
    this.filtersChange.emit({ formula: this.form.controls.formula.value });
  }

  protected applyKind(): void {
    this.filtersChange.emit({ kind: this.form.controls.kind.value });
  }

  protected applyStatuses(): void {
    const chosen = this.form.controls.statuses.value;
    // In the order of the work, whatever order they were ticked in.
    this.filtersChange.emit({ statuses: BATCH_STATUSES.filter((s) => chosen.includes(s)) });
  }

  protected applyOperator(): void {
    const choice = this.form.controls.operator.value;
    if (choice === 'other') {
      // Wait for the id to be typed; an empty box changes nothing yet.
      if (this.form.controls.operatorId.value.trim() !== '') this.applyOperatorId();
      return;
    }
    this.form.controls.operatorId.setValue('');
    this.filtersChange.emit({ operator: choice });
  }

  protected applyOperatorId(): void {
    const text = this.form.controls.operatorId.value.trim();
    const id = Number(text);
    if (text === '') this.filtersChange.emit({ operator: null });
    else if (Number.isSafeInteger(id) && id >= 1) this.filtersChange.emit({ operator: id });
  }

  protected applyDates(): void {
    const { from, to } = this.form.getRawValue();
    this.filtersChange.emit({ from: isoDateOf(from), to: isoDateOf(to) });
  }

  /** Waits for a pause in typing, so each keystroke does not ask the server. */
  protected typeLot(): void {
    clearTimeout(this.lotTimer);
    this.lotTimer = setTimeout(() => this.applyLot(), LOT_DELAY_MS);
  }

  protected applyLot(): void {
    clearTimeout(this.lotTimer);
    const lot = this.form.controls.lot.value.trim().toUpperCase();
    this.filtersChange.emit({ lot: /^[0-9A-Z-]{1,20}$/.test(lot) ? lot : null });
  }

  protected clearFilters(): void {
    clearTimeout(this.lotTimer);
    this.filtersChange.emit({
      formula: null,
      kind: null,
      statuses: [],
      operator: null,
      from: null,
      to: null,
      lot: null,
      show: null,
    });
  }

  private showQuery(query: LogQuery, operators: readonly PersonRef[]): void {
    const known = query.operator !== null && operators.some((p) => p.id === query.operator);
    const typedLot = this.form.controls.lot.value.trim().toUpperCase();
    const choosingId =
      query.operator === null &&
      this.form.controls.operator.value === 'other' &&
      this.form.controls.operatorId.value.trim() === '';
    this.form.patchValue(
      {
        formula: query.formula,
        kind: query.kind,
        statuses: [...query.statuses],
        operator: choosingId
          ? 'other'
          : query.operator === null
            ? null
            : known
              ? query.operator
              : 'other',
        operatorId: query.operator !== null && !known ? String(query.operator) : '',
        from: query.from ? localDateOf(query.from) : null,
        to: query.to ? localDateOf(query.to) : null,
        // Leave what is being typed alone while it still says the same thing.
        ...(typedLot === (query.lot ?? '') ? {} : { lot: query.lot ?? '' }),
      },
      { emitEvent: false },
    );
  }
}
