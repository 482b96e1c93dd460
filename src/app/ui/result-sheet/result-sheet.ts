import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { NgTemplateOutlet } from '@angular/common';
import { MatIcon } from '@angular/material/icon';
import { criticalFailures } from '../../../../shared/calculation/calc-result.ts';
import type {
  PresentedCheck,
  PresentedFigure,
  PresentedResult,
} from '../../../../shared/presentation/presented-result.ts';
import { OptionWordsPipe } from '../option-words-pipe';

let nextId = 0;

const VERDICT_ICONS: Record<PresentedCheck['verdict'], string> = {
  PASS: 'check_circle',
  FAIL: 'cancel',
  WARN: 'warning',
};

/**
 * A batch sheet: a calculated batch printed in the order the work is done — what it is for, what
 * to weigh, the figures, the method, the hold, the checks with PASS, FAIL or WARN in words and
 * colour, then warnings, cautions and allergens. A batch refused by a critical limit shows the
 * refusal and nothing to weigh. Presentational only; prints on its own.
 */
@Component({
  selector: 'app-result-sheet',
  imports: [NgTemplateOutlet, MatIcon, OptionWordsPipe],
  templateUrl: './result-sheet.html',
  styleUrl: './result-sheet.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResultSheet {
  /** The calculated batch, as the API presents it. */
  readonly result = input.required<PresentedResult>();
  /** Heading level of the sheet's title; its sections are one level below. */
  readonly headingLevel = input(2);
  /** Whether to leave out the method and notes (shown elsewhere, as in an editor's preview). */
  readonly compact = input(false);

  protected readonly titleId = `result-sheet-${nextId++}`;
  protected readonly sectionLevel = computed(() => Math.min(this.headingLevel() + 1, 6));
  protected readonly unitsLabel = computed(() =>
    this.result().units === 'us' ? 'US units' : 'Metric units',
  );
  protected readonly kindLabel = computed(() => {
    const kind = this.result().formula.kind;
    return kind.charAt(0).toUpperCase() + kind.slice(1);
  });
  protected readonly checks = computed(() =>
    this.result().checks.map((check) => ({
      ...check,
      icon: VERDICT_ICONS[check.verdict],
      tone: check.verdict.toLowerCase(),
    })),
  );
  // The template context is untyped; this gives the figure list its type back.
  protected asFigures(figures: unknown): readonly PresentedFigure[] {
    return figures as readonly PresentedFigure[];
  }

  protected totalLabel(label: string): string {
    return /total/i.test(label) ? label : `${label} (total)`;
  }

  protected readonly failedCritical = computed(() => criticalFailures(this.result().checks));
}
