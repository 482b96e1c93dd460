import { ChangeDetectionStrategy, Component, computed, effect, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { ActivatedRoute, Router } from '@angular/router';
import type { TraceSearch } from '../../../../shared/api/trace-record.ts';
import { searchWords } from '../../../../shared/presentation/trace-words.ts';
import { paramsOfSearch, recallUrl, searchFromParams } from '../trace-search';
import { TraceStore } from '../trace-store';
import { TraceTree } from '../trace-tree/trace-tree';

/**
 * Trace: a batch's or a received lot's code, or a supplier's lot number, and the answer as trees
 * both ways — what went into it, where it went — with each batch linked to its page and the recall
 * report to download as a PDF or CSV. The search lives in the address (?lot=… or
 * ?supplierLot=…&supplier=…), so a recall can be linked.
 */
@Component({
  selector: 'app-trace-page',
  imports: [
    ReactiveFormsModule,
    MatButton,
    MatAnchor,
    MatButtonToggleGroup,
    MatButtonToggle,
    MatFormField,
    MatLabel,
    MatHint,
    MatInput,
    MatIcon,
    MatProgressBar,
    TraceTree,
  ],
  templateUrl: './trace-page.html',
  styleUrl: './trace-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class TracePage {
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  protected readonly store = inject(TraceStore);

  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly form = this.fb.group({
    by: this.fb.control<'lot' | 'supplier-lot'>('lot'),
    lot: '',
    supplierLot: '',
    supplier: '',
  });
  protected readonly by = toSignal(this.form.controls.by.valueChanges, {
    initialValue: this.form.controls.by.value,
  });

  private readonly params = toSignal(this.route.queryParamMap);
  /** The search the address names. */
  protected readonly search = computed(() => {
    const params = this.params();
    return params ? searchFromParams(params) : null;
  });
  /** What was traced in words, split around its code, so the heading keeps the code on one line. */
  protected readonly searched = computed(() => {
    const result = this.store.result();
    if (!result) return { before: '', code: '', after: '' };
    const search = result.forward.searched;
    const words = searchWords(search);
    const code = 'lot' in search ? search.lot : search.supplierLot;
    const at = words.indexOf(code);
    if (at < 0) return { before: words, code: '', after: '' };
    return { before: words.slice(0, at), code, after: words.slice(at + code.length) };
  });
  protected readonly pdfUrl = computed(() => this.downloadUrl('pdf'));
  protected readonly csvUrl = computed(() => this.downloadUrl('csv'));

  constructor() {
    // The address is the search: typed, followed from a link, or come back to.
    effect(() => {
      const search = this.search();
      if (!search) return;
      this.form.setValue({
        by: 'lot' in search ? 'lot' : 'supplier-lot',
        lot: 'lot' in search ? search.lot : '',
        supplierLot: 'supplierLot' in search ? search.supplierLot : '',
        supplier: 'supplierLot' in search ? (search.supplier ?? '') : '',
      });
      void this.store.trace(search);
    });
  }

  /** Puts the typed search in the address, which runs it. */
  protected submit(): void {
    const { by, lot, supplierLot, supplier } = this.form.getRawValue();
    const search: TraceSearch | null =
      by === 'lot'
        ? lot.trim()
          ? { lot: lot.trim() }
          : null
        : supplierLot.trim()
          ? { supplierLot: supplierLot.trim(), supplier: supplier.trim() }
          : null;
    if (!search) return;
    const query = paramsOfSearch(search);
    if (!query['supplier']) delete query['supplier'];
    void this.router.navigate([], { queryParams: query });
  }

  private downloadUrl(format: 'pdf' | 'csv'): string | null {
    const result = this.store.result();
    return result ? recallUrl(format, result.forward.searched) : null;
  }
}
