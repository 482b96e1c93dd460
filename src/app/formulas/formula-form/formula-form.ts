import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { AssemblyParts } from '../assembly-parts/assembly-parts';
import { BlendFields } from '../blend-fields/blend-fields';
import { CureFields } from '../cure-fields/cure-fields';
import { DoughFields } from '../dough-fields/dough-fields';
import type { FormulaKind } from '../formula-api-types';
import { FormulaForm as FormulaFormGroup } from '../formula-form-model';
import { IngredientTable } from '../ingredient-table/ingredient-table';
import { watchControl } from '../watch-control';
import { YieldsFields } from '../yields-fields/yields-fields';

const PCT_HEADINGS: Record<FormulaKind, string> = {
  cure: '% of green weight',
  dough: "Baker's %",
  blend: '% of meat',
  mix: '% of the base',
  // An assembly has parts, not ingredients.
  assembly: '',
};

/**
 * A formula as a structured form: title, ingredients, the fields of its kind, yields, method,
 * cautions and notes; an assembly has its parts instead of ingredients and yields. Read-only
 * people see the same form, locked.
 */
@Component({
  selector: 'app-formula-form',
  imports: [
    ReactiveFormsModule,
    MatFormField,
    MatLabel,
    MatHint,
    MatInput,
    MatIcon,
    IngredientTable,
    CureFields,
    DoughFields,
    BlendFields,
    YieldsFields,
    AssemblyParts,
  ],
  templateUrl: './formula-form.html',
  styleUrl: './formula-form.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FormulaForm {
  /** The form. */
  readonly form = input.required<FormulaFormGroup>();
  /** The formula's kind. */
  readonly kind = input.required<FormulaKind>();
  /** Whether the form can only be read. */
  readonly readOnly = input(false);
  /** Whether the form shows what the YAML says; false while the YAML has errors. */
  readonly inStep = input(true);
  /** The formula's id (an assembly cannot name itself as a part). */
  readonly formulaId = input<string | null>(null);

  protected readonly cureMethod = watchControl(
    this.form,
    (form) => form.controls.cure.controls.method.value,
  );
  protected readonly pctHeading = computed(() =>
    this.kind() === 'cure' && this.cureMethod() === 'brine'
      ? '% of meat + water'
      : PCT_HEADINGS[this.kind()],
  );
  protected readonly ingredientsCaption = computed(() =>
    this.kind() === 'blend' ? 'Seasoning (optional)' : 'Ingredients',
  );
}
