import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { FormulaDiff } from '../formula-api-types';
import { DiffRow, sideBySide } from './side-by-side';

/** A block of rows: one hunk, or the whole file. */
interface DiffBlock {
  readonly heading: string;
  readonly rows: readonly DiffRow[];
}

/**
 * Two revisions of a formula side by side: removed lines on the left marked "−", added lines on
 * the right marked "+", in colour and in words for screen readers. Shows the changed parts with
 * a few lines around them, or the whole file. Each side is named in words (when, and how it came
 * to be), not by its hash.
 */
@Component({
  selector: 'app-revision-diff',
  imports: [MatButton],
  templateUrl: './revision-diff.html',
  styleUrl: './revision-diff.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionDiff {
  /** The diff to show. */
  readonly diff = input.required<FormulaDiff>();
  /** What to call the old side. */
  readonly fromLabel = input('Older');
  /** What to call the new side. */
  readonly toLabel = input('Newer');
  /** The old side in words, beside its label: when and how it came to be; never a hash. */
  readonly fromWords = input<string | null>(null);
  /** The new side in words, beside its label. */
  readonly toWords = input<string | null>(null);

  protected readonly wholeFile = signal(false);
  protected readonly summary = computed(() => {
    const diff = this.diff();
    if (!diff.changed) return 'The two revisions say exactly the same.';
    return `${diff.added} ${diff.added === 1 ? 'line' : 'lines'} added, ${diff.removed} removed`;
  });
  protected readonly blocks = computed((): DiffBlock[] => {
    const diff = this.diff();
    if (this.wholeFile()) return [{ heading: 'The whole file', rows: sideBySide(diff.lines) }];
    return diff.hunks.map((hunk) => ({
      heading: `Lines ${span(hunk.oldStart, hunk.oldLines)} before, ${span(hunk.newStart, hunk.newLines)} after`,
      rows: sideBySide(hunk.lines),
    }));
  });

  protected toggleWholeFile(): void {
    this.wholeFile.update((whole) => !whole);
  }
}

function span(start: number, count: number): string {
  if (count === 0) return 'none';
  return count === 1 ? `${start}` : `${start}–${start + count - 1}`;
}
