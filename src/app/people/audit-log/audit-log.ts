import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, OnInit, computed, inject } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import {
  MatCell,
  MatCellDef,
  MatColumnDef,
  MatHeaderCell,
  MatHeaderCellDef,
  MatHeaderRow,
  MatHeaderRowDef,
  MatRow,
  MatRowDef,
  MatTable,
} from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { debounceTime } from 'rxjs';
import { AUDIT_ACTIONS, AuditAction, AuditEvent, actionText, detailText } from '../audit-event';
import { AuditFilter, AuditStore } from '../audit-store';
import { AuditSubject, actorText, subjectOf } from '../audit-subject';
import { PeopleStore } from '../people-store';
import { FormulaStore } from '../../formulas/formula-store';
import { OlderPagesFooter } from '../older-pages-footer/older-pages-footer';
import { DAY_INPUT_IMPORTS, provideDayInputs } from '../../ui/batch-sheet/day-input-formats';
import { IsoDayPipe, isoDateOf, localDateOf } from '../../ui/batch-sheet/iso-day-pipe';
import { PHONE_WIDTH, mediaMatch } from '../../ui/media-match';

/** A row of the log with its words worked out once. */
interface AuditRow {
  readonly event: AuditEvent;
  readonly who: string;
  readonly action: string;
  readonly subject: AuditSubject | null;
  readonly detail: string;
}

/** The filter as the form holds it: '' (or no day) for "any". */
type FilterForm = FormGroup<{
  action: FormControl<AuditAction | ''>;
  actor: FormControl<string>;
  subject: FormControl<string>;
  fromDay: FormControl<Date | null>;
  toDay: FormControl<Date | null>;
}>;

/**
 * The audit log: sign-ins, formula saves, batch events and people changes, newest first, by name,
 * with lots and formulas linked to their pages; narrowed by what, who, to what and when.
 */
@Component({
  selector: 'app-audit-log',
  imports: [
    IsoDayPipe,
    NgTemplateOutlet,
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatInput,
    DAY_INPUT_IMPORTS,
    MatHint,
    MatSuffix,
    MatTable,
    MatColumnDef,
    MatHeaderCellDef,
    MatHeaderCell,
    MatCellDef,
    MatCell,
    MatHeaderRowDef,
    MatHeaderRow,
    MatRowDef,
    MatRow,
    MatIcon,
    MatFormField,
    MatLabel,
    MatSelect,
    MatOption,
    MatProgressBar,
    OlderPagesFooter,
  ],
  providers: [provideDayInputs()],
  templateUrl: './audit-log.html',
  styleUrls: ['../people-tab.css', './audit-log.css'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class AuditLog implements OnInit {
  private readonly store = inject(AuditStore);
  private readonly peopleStore = inject(PeopleStore);
  private readonly formulaStore = inject(FormulaStore);
  /** Formulas by title in the "to what" column; ids until the list has arrived. */
  private readonly titles = computed(
    () =>
      new Map(
        (this.formulaStore.formulas() ?? []).flatMap((formula) =>
          formula.id && formula.title ? [[formula.id, formula.title] as const] : [],
        ),
      ),
  );

  protected readonly actions = AUDIT_ACTIONS;
  protected readonly people = this.peopleStore.people;
  protected readonly loading = this.store.loading;
  protected readonly loaded = this.store.loaded;
  protected readonly failure = this.store.failure;
  protected readonly hasMore = this.store.hasMore;
  protected readonly filtered = computed(() =>
    Object.values(this.store.filter()).some((value) => value !== undefined),
  );
  protected readonly rows = computed<readonly AuditRow[]>(() =>
    this.store.events().map((event) => ({
      event,
      who: actorText(event),
      action: actionText(event),
      subject: subjectOf(event, this.titles()),
      detail: detailText(event),
    })),
  );
  /** A phone: what was done carries to what, who, when and the detail beneath it. */
  protected readonly narrow = mediaMatch(PHONE_WIDTH);
  protected readonly columns = computed(() =>
    this.narrow() ? ['action'] : ['at', 'who', 'action', 'subject', 'detail'],
  );
  protected readonly filterForm: FilterForm = new FormGroup({
    action: new FormControl<AuditAction | ''>('', { nonNullable: true }),
    actor: new FormControl('', { nonNullable: true }),
    subject: new FormControl('', { nonNullable: true }),
    fromDay: new FormControl<Date | null>(null),
    toDay: new FormControl<Date | null>(null),
  });

  constructor() {
    // Typing in the object field waits for a pause; the lists and dates apply at once too.
    this.filterForm.valueChanges
      .pipe(debounceTime(300), takeUntilDestroyed())
      .subscribe(() => void this.store.load(this.filterOf()));
  }

  ngOnInit(): void {
    const filter = this.store.filter();
    this.filterForm.setValue(
      {
        action: filter.action ?? '',
        actor: filter.actor ?? '',
        subject: filter.subject ?? '',
        fromDay: filter.fromDay ? localDateOf(filter.fromDay) : null,
        toDay: filter.toDay ? localDateOf(filter.toDay) : null,
      },
      { emitEvent: false },
    );
    void this.store.load();
    if (!this.peopleStore.loaded()) void this.peopleStore.load();
    if (!this.formulaStore.formulas()) void this.formulaStore.loadList();
  }

  protected clearFilters(): void {
    this.filterForm.reset();
  }

  protected reload(): void {
    void this.store.load();
  }

  protected loadMore(): void {
    void this.store.loadMore();
  }

  private filterOf(): AuditFilter {
    const { action, actor, subject, fromDay, toDay } = this.filterForm.getRawValue();
    return {
      action: action || undefined,
      actor: actor || undefined,
      subject: subject.trim() || undefined,
      fromDay: isoDateOf(fromDay) ?? undefined,
      toDay: isoDateOf(toDay) ?? undefined,
    };
  }
}
