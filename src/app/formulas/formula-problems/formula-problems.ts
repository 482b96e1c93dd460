import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import type { FormulaProblem } from '../formula-api-types';
import { problemText } from './problems-of';

/**
 * A formula's problems as a list, each "line N, column M: message" with its severity in words.
 * Choosing a problem that has a position asks for the caret to go there.
 */
@Component({
  selector: 'app-formula-problems',
  imports: [MatIcon],
  templateUrl: './formula-problems.html',
  styleUrl: './formula-problems.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FormulaProblems {
  /** The problems to list. */
  readonly problems = input.required<readonly FormulaProblem[]>();
  /** Whether choosing a problem can move the caret (there is an editor to move it in). */
  readonly navigable = input(true);
  /** Emits the problem chosen. */
  readonly chosen = output<FormulaProblem>();

  protected readonly items = computed(() =>
    this.problems().map((problem) => ({
      problem,
      text: problemText(problem),
      error: problem.severity === 'error',
      canGo: this.navigable() && problem.line > 0,
    })),
  );
  protected readonly summary = computed(() => {
    const errors = this.problems().filter((p) => p.severity === 'error').length;
    const warnings = this.problems().length - errors;
    const parts = [];
    if (errors > 0) parts.push(`${errors} ${errors === 1 ? 'error' : 'errors'}`);
    if (warnings > 0) parts.push(`${warnings} ${warnings === 1 ? 'warning' : 'warnings'}`);
    return parts.join(', ');
  });

  protected choose(problem: FormulaProblem): void {
    this.chosen.emit(problem);
  }
}
