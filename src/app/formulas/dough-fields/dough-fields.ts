import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { DoughGroup, prefermentRow } from '../formula-form-model';
import { watchControl } from '../watch-control';

/**
 * The fields only a dough has: the preferment and its own formula, the default piece weight and
 * loss allowance, and the desired dough temperature with the mixer's friction factor.
 */
@Component({
  selector: 'app-dough-fields',
  imports: [
    ReactiveFormsModule,
    MatFormField,
    MatLabel,
    MatHint,
    MatInput,
    MatCheckbox,
    MatButton,
    MatIconButton,
    MatIcon,
  ],
  templateUrl: './dough-fields.html',
  styleUrls: ['../formula-fields.css', './dough-fields.css'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DoughFields {
  private readonly fb = inject(NonNullableFormBuilder);

  /** The dough's own fields. */
  readonly group = input.required<DoughGroup>();
  /** Whether the fields can only be read. */
  readonly readOnly = input(false);

  protected readonly hasPreferment = watchControl(
    this.group,
    (group) => group.controls.hasPreferment.value,
  );
  protected readonly prefermentRows = watchControl(this.group, (group) => [
    ...group.controls.prefermentIngredients.controls,
  ]);

  protected addPrefermentRow(): void {
    this.group().controls.prefermentIngredients.push(prefermentRow(this.fb));
  }

  protected removePrefermentRow(index: number): void {
    this.group().controls.prefermentIngredients.removeAt(index);
  }
}
