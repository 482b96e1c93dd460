import {
  ChangeDetectionStrategy,
  Component,
  effect,
  inject,
  input,
  signal,
  untracked,
} from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatProgressBar } from '@angular/material/progress-bar';
import { messageOf } from '../../core/api/message-of';
import { FormulaDiff, FormulaRevision, shortRevision } from '../formula-api-types';
import { FormulaStore } from '../formula-store';
import { SOURCE_LABELS } from '../formula-vocabulary';
import { RevisionDiff } from '../revision-diff/revision-diff';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';

/**
 * A formula's history, newest first: who changed it, when, why and how, with the revision and
 * its git commit. Choosing two revisions shows what changed between them, side by side.
 */
@Component({
  selector: 'app-formula-history',
  imports: [IsoDayPipe, MatCheckbox, MatButton, MatProgressBar, RevisionDiff],
  templateUrl: './formula-history.html',
  styleUrl: './formula-history.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FormulaHistory {
  private readonly store = inject(FormulaStore);

  /** The formula's id. */
  readonly formulaId = input.required<string>();
  /** The revision on disk now; the history is fetched again when it changes. */
  readonly currentRevision = input<string | null>(null);

  protected readonly revisions = signal<readonly FormulaRevision[]>([]);
  protected readonly loading = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly chosen = signal<readonly string[]>([]);
  protected readonly diff = signal<FormulaDiff | null>(null);
  protected readonly diffLoading = signal(false);
  protected readonly diffError = signal<string | null>(null);
  protected readonly short = shortRevision;
  protected readonly sources = SOURCE_LABELS;

  constructor() {
    effect(() => {
      const id = this.formulaId();
      this.currentRevision();
      untracked(() => void this.load(id));
    });
  }

  protected isChosen(revision: string): boolean {
    return this.chosen().includes(revision);
  }

  protected toggle(revision: string, checked: boolean): void {
    const now = this.chosen().filter((item) => item !== revision);
    // Two at most: choosing a third lets go of the first one chosen.
    this.chosen.set(checked ? [...now, revision].slice(-2) : now);
    void this.compare();
  }

  protected clear(): void {
    this.chosen.set([]);
    this.diff.set(null);
    this.diffError.set(null);
  }

  private async load(id: string): Promise<void> {
    this.loading.set(true);
    this.error.set(null);
    try {
      const history = await this.store.revisions(id);
      this.revisions.set(history.revisions);
      const known = new Set(history.revisions.map((row) => row.revision));
      this.chosen.update((chosen) => chosen.filter((revision) => known.has(revision)));
    } catch (error) {
      this.error.set(messageOf(error));
    } finally {
      this.loading.set(false);
    }
  }

  private async compare(): Promise<void> {
    const chosen = this.chosen();
    this.diff.set(null);
    this.diffError.set(null);
    if (chosen.length !== 2) return;
    // The list is newest first: the one further down is the older.
    const order = this.revisions().map((row) => row.revision);
    const [from, to] = [...chosen].sort((a, b) => order.indexOf(b) - order.indexOf(a));
    this.diffLoading.set(true);
    try {
      const diff = await this.store.diff(this.formulaId(), from, to);
      if (this.chosen().join() === chosen.join()) this.diff.set(diff);
    } catch (error) {
      this.diffError.set(messageOf(error));
    } finally {
      this.diffLoading.set(false);
    }
  }
}
