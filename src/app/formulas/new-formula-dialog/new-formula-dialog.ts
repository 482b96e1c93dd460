import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import {
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogRef,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import type { CureMethod } from '../../../../shared/formula/formula-types.ts';
import {
  LIBRARY_SCHEMA_PATH,
  starterFormula,
} from '../../../../shared/formula/starters/starter-formula.ts';
import { messageOf } from '../../core/api/message-of';
import { FORMULA_ID } from '../../../../shared/formula/formula-id.ts';
import type { FormulaKind, FormulaProblem } from '../formula-api-types';
import { FormulaProblems } from '../formula-problems/formula-problems';
import { problemsOf } from '../formula-problems/problems-of';
import { FormulaStore } from '../formula-store';
import { CURE_METHODS, KINDS } from '../formula-vocabulary';

/**
 * Starts a new formula from the starter of the chosen kind (and cure method), the same text
 * `larder new` writes; closes with the new formula's id.
 */
@Component({
  selector: 'app-new-formula-dialog',
  imports: [
    ReactiveFormsModule,
    MatDialogTitle,
    MatDialogContent,
    MatDialogActions,
    MatDialogClose,
    MatFormField,
    MatLabel,
    MatHint,
    MatError,
    MatInput,
    MatSelect,
    MatOption,
    MatButton,
    FormulaProblems,
  ],
  templateUrl: './new-formula-dialog.html',
  styleUrl: './new-formula-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NewFormulaDialog {
  private readonly store = inject(FormulaStore);
  private readonly dialog = inject<MatDialogRef<NewFormulaDialog, string>>(MatDialogRef);

  protected readonly kinds = KINDS;
  protected readonly methods = CURE_METHODS;
  protected readonly form = inject(NonNullableFormBuilder).group({
    kind: ['cure' as FormulaKind, Validators.required],
    method: ['dry' as CureMethod, Validators.required],
    id: ['', [Validators.required, Validators.pattern(FORMULA_ID)]],
    title: ['', [Validators.required, Validators.maxLength(120)]],
    message: ['New formula', [Validators.required, Validators.pattern(/\S/)]],
  });
  // The cure method applies only to a cure; the template follows the kind through this signal.
  protected readonly kind = toSignal(this.form.controls.kind.valueChanges, {
    initialValue: this.form.controls.kind.value,
  });
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly problems = signal<FormulaProblem[]>([]);

  protected async create(): Promise<void> {
    if (this.busy()) return;
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { kind, method, id, title, message } = this.form.getRawValue();
    this.busy.set(true);
    this.failure.set(null);
    this.problems.set([]);
    try {
      // An assembly starts from formulas the library has (the list page has read it).
      const yaml = starterFormula(kind, {
        id,
        title: title.trim(),
        method,
        schemaPath: LIBRARY_SCHEMA_PATH,
        library: this.store.formulas() ?? [],
      });
      const outcome = await this.store.create(yaml, message.trim());
      this.dialog.close(outcome.id);
    } catch (error) {
      this.failure.set(messageOf(error));
      this.problems.set(problemsOf(error));
    } finally {
      this.busy.set(false);
    }
  }
}
