import {
  ChangeDetectionStrategy,
  Component,
  OnInit,
  computed,
  inject,
  signal,
} from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatChipListbox, MatChipListboxChange, MatChipOption } from '@angular/material/chips';
import { MatDialog } from '@angular/material/dialog';
import { MatFormField, MatHint, MatLabel, MatPrefix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
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
import { Router, RouterLink } from '@angular/router';
import { SessionStore } from '../../core/auth/session-store';
import { FormulaKind, FormulaSummary } from '../formula-api-types';
import { FormulaStore } from '../formula-store';
import { FormulaUpload } from '../formula-upload/formula-upload';
import { KIND_LABELS } from '../formula-vocabulary';
import { NewFormulaDialog } from '../new-formula-dialog/new-formula-dialog';
import { revisionInWords } from '../revision-words';
import { matchesSearch, sortedByTitle } from './formula-search';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';

/**
 * Every formula file by title: kind, whether it is valid and how it last changed in words,
 * filtered by kind and by what is typed in the search (title, id or file name). A row opens its formula. Admins start new formulas and upload files here.
 */
@Component({
  selector: 'app-formula-list',
  imports: [
    IsoDayPipe,
    RouterLink,
    MatButton,
    MatIcon,
    MatFormField,
    MatLabel,
    MatHint,
    MatPrefix,
    MatInput,
    MatProgressBar,
    MatChipListbox,
    MatChipOption,
    MatTable,
    MatColumnDef,
    MatHeaderCell,
    MatHeaderCellDef,
    MatCell,
    MatCellDef,
    MatHeaderRow,
    MatHeaderRowDef,
    MatRow,
    MatRowDef,
    FormulaUpload,
  ],
  templateUrl: './formula-list.html',
  styleUrl: './formula-list.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class FormulaList implements OnInit {
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);
  private readonly session = inject(SessionStore);
  protected readonly store = inject(FormulaStore);

  protected readonly columns = ['title', 'kind', 'status', 'changed'];
  protected readonly kindLabels: Partial<Record<string, string>> = KIND_LABELS;
  protected readonly changeWords = (row: FormulaSummary): string =>
    revisionInWords({ source: row.lastChangeSource, author: row.lastChangedBy });
  protected readonly isAdmin = computed(() => this.session.person()?.role === 'admin');
  protected readonly kind = signal<FormulaKind | 'all'>('all');
  protected readonly filters = computed(() => {
    const all = this.store.formulas() ?? [];
    const count = (kind: FormulaKind) => all.filter((item) => item.kind === kind).length;
    return [
      { value: 'all' as const, label: `All (${all.length})` },
      ...this.store.kinds().map((kind) => ({
        value: kind,
        label: `${KIND_LABELS[kind]} (${count(kind)})`,
      })),
    ];
  });
  /** What is typed in the search box. */
  protected readonly search = signal('');
  protected readonly rows = computed(() => {
    const kind = this.kind();
    const all = this.store.formulas() ?? [];
    const ofKind = kind === 'all' ? all : all.filter((item) => item.kind === kind);
    return sortedByTitle(ofKind.filter((item) => matchesSearch(item, this.search())));
  });

  ngOnInit(): void {
    void this.store.loadList();
  }

  protected typeSearch(event: Event): void {
    this.search.set((event.target as HTMLInputElement).value);
  }

  protected chooseKind(change: MatChipListboxChange): void {
    // A chip listbox can be emptied by choosing the chosen chip again: that means all kinds.
    this.kind.set((change.value as FormulaKind | 'all' | undefined) ?? 'all');
  }

  protected open(row: FormulaSummary, event?: Event): void {
    // A click on the title link navigates by itself.
    if (!row.id || (event?.target as HTMLElement | null)?.closest('a')) return;
    void this.router.navigate(['/formulas', row.id]);
  }

  protected reload(): void {
    void this.store.loadList();
  }

  protected startNew(): void {
    this.dialog
      .open<NewFormulaDialog, void, string>(NewFormulaDialog, { autoFocus: 'first-tabbable' })
      .afterClosed()
      .subscribe((id) => {
        if (id) void this.router.navigate(['/formulas', id]);
      });
  }

  protected openUploaded(id: string): void {
    void this.router.navigate(['/formulas', id]);
  }
}
