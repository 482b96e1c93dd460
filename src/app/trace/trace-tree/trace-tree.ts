import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { RouterLink } from '@angular/router';
import type { TraceNode } from '../../../../shared/api/trace-record.ts';
import {
  CUT_WORDS,
  lotFacts,
  lotName,
  useWords,
} from '../../../../shared/presentation/trace-words.ts';

/** One lot of the tree as the screen shows it. */
interface TreeLine {
  readonly name: string;
  /** The batch page of a batch; received lots have none. */
  readonly batch: string | null;
  readonly use: string | null;
  readonly facts: string;
  readonly cut: string | null;
  readonly children: readonly TreeLine[];
}

function lineOf(node: TraceNode): TreeLine {
  return {
    name: lotName(node.lot),
    batch: node.lot.kind === 'batch' ? node.lot.lotCode : null,
    use: node.use ? useWords(node.use) : null,
    facts: lotFacts(node.lot),
    cut: node.cut ? CUT_WORDS[node.cut] : null,
    children: node.children.map(lineOf),
  };
}

/**
 * A trace as an indented tree, one lot a row: its name (a batch's links to its page), the amount
 * used and the day, its facts (supplier and lot, or status and days), and why a branch stops.
 */
@Component({
  selector: 'app-trace-tree',
  imports: [RouterLink, NgTemplateOutlet],
  templateUrl: './trace-tree.html',
  styleUrl: './trace-tree.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TraceTree {
  /** The roots of the tree. */
  readonly roots = input.required<readonly TraceNode[]>();
  /** What the tree is, for a screen reader: "Made from". */
  readonly label = input.required<string>();

  protected readonly lines = computed(() => this.roots().map(lineOf));
}
