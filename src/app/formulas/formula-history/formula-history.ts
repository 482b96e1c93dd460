import {
  ChangeDetectionStrategy,
  Component,
  computed,
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
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import { FormulaDiff, FormulaRevision } from '../formula-api-types';
import { FormulaStore } from '../formula-store';
import { revisionInWords } from '../revision-words';
import { RevisionDiff } from '../revision-diff/revision-diff';

/**
 * A formula's history, newest first: when it changed, how and by whom in words ("edited in the
 * console by Rosa Quennick", "changed in the files"), and the note left with it; no hashes.
 * Choosing two revisions shows what changed between them, side by side.
 */
/** Days and times in words, as everywhere in the console. */
const MOMENT = new IsoDayPipe();

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
  /** The two versions compared, in words: "3 Dec 2026, 14:02, edited in the console by …". */
  protected readonly diffWords = computed(() => {
    const d = this.diff();
    const row = (revision: string | undefined) =>
      this.revisions().find((item) => item.revision === revision);
    const from = row(d?.from.revision);
    const to = row(d?.to.revision);
    return { from: from ? this.labelOf(from) : null, to: to ? this.labelOf(to) : null };
  });

  constructor() {
    effect(() => {
      const id = this.formulaId();
      this.currentRevision();
      untracked(() => void this.load(id));
    });
  }

  /** How a revision came to be, in words. */
  protected words(row: FormulaRevision): string {
    const text = revisionInWords(row);
    return text[0].toUpperCase() + text.slice(1);
  }

  /** A revision as people tell it apart: when, and how it came to be. */
  protected labelOf(row: FormulaRevision): string {
    return `${MOMENT.transform(row.at, true)}, ${revisionInWords(row)}`;
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
