import { NgTemplateOutlet } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  signal,
  untracked,
} from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import {
  MatExpansionPanel,
  MatExpansionPanelHeader,
  MatExpansionPanelTitle,
} from '@angular/material/expansion';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSort, MatSortHeader, type Sort } from '@angular/material/sort';
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
import { ActivatedRoute, Router, RouterLink, type ParamMap } from '@angular/router';
import { SessionStore } from '../../core/auth/session-store';
import { BatchStatusChip } from '../../ui/batch-sheet/batch-status-chip';
import { IsoDayPipe, isoDateOf } from '../../ui/batch-sheet/iso-day-pipe';
import { mediaMatch } from '../../ui/media-match';
import type { BatchListItem } from '../batch-types';
import { FormulaOptions } from '../formula-options';
import { NitriteChart } from '../nitrite-chart/nitrite-chart';
import { BatchFilters, type FilterChange } from './batch-filters';
import { BatchLogCards } from './batch-log-cards';
import { BatchLog } from './batch-log';
import { CursorPaginator } from './cursor-paginator';
import {
  DEFAULT_QUERY,
  SHOWS,
  csvHref,
  filterCount,
  isFiltered,
  paramsFromQuery,
  queryFromParams,
  type LogQuery,
  type LogSort,
  type PageSize,
} from './log-query';
import { logRowsOf } from './log-row';
import { SORT_CHOICES, sortOfValue, sortValueOf } from './log-sorts';

/**
 * Where the table does not fit and the log stacks as cards: the table needs 960 px, and wider
 * than 840 px the navigation beside it takes 220 px and the margins 48 (src/app/core/layout/shell).
 */
const STACKED = '(max-width: 1229.98px)';

/**
 * The batch log: every recorded batch, sorted, filtered and paged on the server, with the view
 * kept in the address bar so it can be shared and reloaded; a CSV export of exactly that view;
 * and, folded away, the ingoing nitrite of a cure formula over time.
 */
@Component({
  selector: 'app-batch-log-page',
  imports: [
    RouterLink,
    NgTemplateOutlet,
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
    MatSort,
    MatSortHeader,
    MatButton,
    MatIcon,
    MatFormField,
    MatLabel,
    MatSelect,
    MatOption,
    MatProgressBar,
    MatExpansionPanel,
    MatExpansionPanelHeader,
    MatExpansionPanelTitle,
    BatchFilters,
    CursorPaginator,
    BatchLogCards,
    BatchStatusChip,
    IsoDayPipe,
    NitriteChart,
  ],
  templateUrl: './batch-log-page.html',
  styleUrls: ['../../ui/verdict.css', './log-marks.css', './batch-log-page.css'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class BatchLogPage {
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly session = inject(SessionStore);
  protected readonly log = inject(BatchLog);
  protected readonly formulaOptions = inject(FormulaOptions);

  private readonly params = toSignal(this.route.queryParamMap, { requireSync: true });
  protected readonly query = computed(() => queryFromParams(paramRecord(this.params())));
  /** The page's batches as the table shows them, with the marks a row carries. */
  protected readonly rows = computed(() => logRowsOf(this.log.items(), this.today));
  /** A phone or a tablet: the batches as stacked cards, sorted by a select, the filters folded. */
  protected readonly narrow = mediaMatch(STACKED);
  /** The kitchen's day, for "overdue"; read when the page opens. */
  protected readonly today = isoDateOf(new Date()) ?? '';
  protected readonly exportHref = computed(() => csvHref(this.query(), this.today));
  protected readonly shows = SHOWS;
  protected readonly filtered = computed(() => isFiltered(this.query()));
  protected readonly filterCount = computed(() => filterCount(this.query()));
  protected readonly sortChoices = SORT_CHOICES.map((choice) => ({
    value: sortValueOf(choice),
    words: choice.words,
  }));
  protected readonly sortValue = computed(() => sortValueOf(this.query()));
  protected readonly canRecord = computed(() => this.session.hasRole('admin', 'cook'));
  protected readonly columns = [
    'lot',
    'formula',
    'kind',
    'operator',
    'started',
    'ready',
    'status',
    'checks',
    'signedOff',
  ];
  /** The sorted column; none when the log is in its own order (newest recorded first). */
  protected readonly sortActive = computed(() =>
    this.query().sort === 'recorded' ? '' : this.query().sort,
  );
  protected readonly sortDirection = computed(() =>
    this.query().sort === 'recorded' ? '' : this.query().order,
  );
  /** The cure formula the chart opens on: the one filtered by, else the first cure. */
  protected readonly chartFormula = computed(() => {
    const id = this.query().formula;
    const cures = this.formulaOptions.cures();
    return cures.find((f) => f.id === id)?.id ?? cures[0]?.id ?? null;
  });
  protected readonly chartOpened = signal(false);

  constructor() {
    effect(() => {
      const query = this.query();
      untracked(() => this.log.show(query));
    });
    void this.formulaOptions.load();
  }

  protected filterBy(change: FilterChange): void {
    this.showView({ ...this.query(), ...change });
  }

  protected sortBy(sort: Sort): void {
    if (sort.direction === '')
      this.showView({ ...this.query(), sort: DEFAULT_QUERY.sort, order: DEFAULT_QUERY.order });
    else this.showView({ ...this.query(), sort: sort.active as LogSort, order: sort.direction });
  }

  /** A choice of the sort select (the stacked log has no column headers). */
  protected sortByValue(value: string): void {
    const sort = sortOfValue(value);
    if (sort) this.showView({ ...this.query(), ...sort });
  }

  protected resize(size: PageSize): void {
    this.showView({ ...this.query(), size });
  }

  protected clearFilters(): void {
    this.filterBy({
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

  protected trackBatch(_index: number, batch: Pick<BatchListItem, 'lotCode'>): string {
    return batch.lotCode;
  }

  private showView(query: LogQuery): void {
    const params = Object.fromEntries(
      Object.entries(paramsFromQuery(query)).filter(([, value]) => value !== null),
    );
    void this.router.navigate([], { relativeTo: this.route, queryParams: params });
  }
}

function paramRecord(map: ParamMap): Record<string, string | undefined> {
  return Object.fromEntries(map.keys.map((key) => [key, map.get(key) ?? undefined]));
}
