import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { messageOf } from '../core/api/message-of';
import type { FormulaDetail, FormulaKind, FormulaListItem } from './batch-types';

/** A formula that batches can be made from, for a select. */
export interface FormulaOption {
  readonly id: string;
  readonly title: string;
  readonly kind: FormulaKind;
}

/**
 * The formulas batches are made from, assemblies among them, read once from GET /api/formulas for
 * the selects of the batch log, the record form and the nitrite chart. Only files that read as a
 * formula are offered.
 */
@Injectable({ providedIn: 'root' })
export class FormulaOptions {
  private readonly http = inject(HttpClient);
  private readonly list = signal<readonly FormulaOption[] | null>(null);
  private readonly failure = signal<string | null>(null);
  private loading: Promise<void> | null = null;

  /** The usable formulas by title; empty until loaded. */
  readonly formulas = computed(() => this.list() ?? []);
  /** Whether the list has arrived. */
  readonly loaded = computed(() => this.list() !== null);
  /** Why the list could not be read, or null. */
  readonly error = this.failure.asReadonly();
  /** The cure formulas, for the nitrite chart. */
  readonly cures = computed(() => this.formulas().filter((f) => f.kind === 'cure'));

  /** Reads the list unless it is already here (or on its way); `force` reads it again. */
  load(force = false): Promise<void> {
    if (this.loading && !force) return this.loading;
    this.failure.set(null);
    this.loading = firstValueFrom(
      this.http.get<{ formulas: readonly FormulaListItem[] }>('/api/formulas'),
    ).then(
      ({ formulas }) => this.list.set(usable(formulas)),
      (error: unknown) => {
        this.loading = null;
        this.failure.set(messageOf(error));
      },
    );
    return this.loading;
  }

  /** The title of a formula id, or the id itself when it is not (or no longer) listed. */
  titleOf(id: string): string {
    return this.formulas().find((f) => f.id === id)?.title ?? id;
  }

  /** One formula's parsed form (method, preferment, components): what the record form asks. */
  detail(id: string): Promise<FormulaDetail> {
    return firstValueFrom(this.http.get<FormulaDetail>(`/api/formulas/${encodeURIComponent(id)}`));
  }
}

function usable(items: readonly FormulaListItem[]): FormulaOption[] {
  const options: FormulaOption[] = [];
  for (const item of items) {
    if (!item.valid || item.duplicate || item.id === null || item.kind === null) continue;
    options.push({ id: item.id, title: item.title ?? item.id, kind: item.kind });
  }
  return options.sort((a, b) => a.title.localeCompare(b.title));
}
