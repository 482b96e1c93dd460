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
import { MatIcon } from '@angular/material/icon';
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
import { FormulaKind, FormulaSummary, shortRevision } from '../formula-api-types';
import { FormulaStore } from '../formula-store';
import { FormulaUpload } from '../formula-upload/formula-upload';
import { KIND_LABELS } from '../formula-vocabulary';
import { NewFormulaDialog } from '../new-formula-dialog/new-formula-dialog';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';

/**
 * Every formula file: title, id, kind, revision, whether it is valid and who changed it last,
 * filtered by kind. A row opens its formula. Admins start new formulas and upload files here.
 */
@Component({
  selector: 'app-formula-list',
  imports: [
    IsoDayPipe,
    RouterLink,
    MatButton,
    MatIcon,
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

  protected readonly columns = ['title', 'id', 'kind', 'revision', 'status', 'changed'];
  protected readonly kindLabels: Partial<Record<string, string>> = KIND_LABELS;
  protected readonly short = shortRevision;
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
  protected readonly rows = computed(() => {
    const kind = this.kind();
    const all = this.store.formulas() ?? [];
    return kind === 'all' ? all : all.filter((item) => item.kind === kind);
  });

  ngOnInit(): void {
    void this.store.loadList();
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
