import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { IsoDayPipe } from './iso-day-pipe';
import type { PresentedResult } from '../../../../shared/presentation/presented-result.ts';
import { OptionWordsPipe } from '../option-words-pipe';
import { FORMULA_KIND_WORDS as KIND_WORDS } from '../../batches/formula-kind-words';

/**
 * A calculated batch as a sheet to work from, top to bottom in the order the work is done:
 * the batch, weigh, mix and apply, hold, check; then cautions. A refused batch (a critical limit
 * exceeded) shows no amounts, so nobody weighs from it by mistake. Prints cleanly; with
 * `signOffLines` the printout ends with lines to sign.
 */
@Component({
  selector: 'app-batch-sheet',
  imports: [NgTemplateOutlet, IsoDayPipe, OptionWordsPipe],
  templateUrl: './batch-sheet.html',
  styleUrl: './batch-sheet.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { 'data-testid': 'batch-sheet' },
})
export class BatchSheet {
  /** The calculation to show, as the API presents it. */
  readonly result = input.required<PresentedResult>();
  /** The level of the sheet's section headings: 2 on a page of its own, 3 inside a section. */
  readonly level = input<2 | 3>(2);
  /** Whether the printed sheet ends with "Weighed by / Checked by" lines to sign. */
  readonly signOffLines = input(false);

  protected readonly refused = computed(() => this.result().critical);
  protected readonly hasPercent = computed(() =>
    this.result().groups.map((group) => group.lines.some((line) => line.percent !== undefined)),
  );
  protected readonly methodShown = computed(
    () => this.result().steps.length > 0 || this.result().figures.length > 0,
  );
  protected readonly checksShown = computed(() => {
    const result = this.result();
    return (
      result.checks.length > 0 ||
      result.warnings.length > 0 ||
      (!result.critical && (!!result.yields?.length || !!result.portions))
    );
  });
  /** Step headings, numbered as shown: a blend has no hold, a refused batch only a check. */
  protected readonly titles = computed(() => {
    const refused = this.refused();
    const shown = [
      ['weigh', 'Weigh', !refused],
      ['method', this.methodWords(), !refused && this.methodShown()],
      ['hold', 'Hold', !refused && !!this.result().schedule],
      ['check', 'Check', this.checksShown()],
    ] as const;
    let n = 0;
    return Object.fromEntries(
      shown.map(([key, words, on]) => [key, on ? `${++n} · ${words}` : words]),
    ) as Record<(typeof shown)[number][0], string>;
  });
  protected readonly kindWords = computed(() => KIND_WORDS[this.result().formula.kind]);
  /** An assembly's parts are put together, not mixed; its lines are parts, not ingredients. */
  protected readonly assembly = computed(() => this.result().formula.kind === 'assembly');
  protected readonly methodWords = computed(() =>
    this.assembly() ? 'Put together' : 'Mix and apply',
  );
  protected readonly unitWords = computed(() =>
    this.result().units === 'us' ? 'US units' : 'metric units',
  );
}
