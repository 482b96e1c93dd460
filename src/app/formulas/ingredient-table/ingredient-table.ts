import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  Injector,
  afterNextRender,
  computed,
  inject,
  input,
} from '@angular/core';
import { FormArray, NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatFormField } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatRadioButton } from '@angular/material/radio';
import { MatOption, MatSelect } from '@angular/material/select';
import type { FormulaKind } from '../formula-api-types';
import { IngredientRow, ingredientRow } from '../formula-form-model';
import { Choice, FOODS, YEASTS } from '../formula-vocabulary';
import { watchControl } from '../watch-control';

let nextId = 0;

/** A column after the name: a number or a single choice (the allergens come last, as text). */
interface Column {
  readonly key: 'pct' | 'nitrite' | 'salt' | 'accelerator' | 'food' | 'water_pct' | 'yeast';
  readonly label: string;
  readonly type: 'number' | 'choice';
  /** Width in px; the table is laid out fixed so a narrow screen scrolls instead of squeezing. */
  readonly width: number;
  readonly choices?: readonly Choice<string>[];
}

const NUMBER = { type: 'number', width: 84 } as const;
const OWN_COLUMNS: Record<FormulaKind, readonly Column[]> = {
  cure: [
    { key: 'nitrite', label: 'Nitrite %', ...NUMBER },
    { key: 'salt', label: 'Salt %', ...NUMBER },
    { key: 'accelerator', label: 'Accelerator %', ...NUMBER },
  ],
  dough: [
    { key: 'food', label: 'Counts as (water content)', type: 'choice', width: 144, choices: FOODS },
    { key: 'water_pct', label: 'Own water %', ...NUMBER },
    { key: 'yeast', label: 'Yeast', type: 'choice', width: 120, choices: YEASTS },
  ],
  blend: [],
  mix: [],
  assembly: [],
};
// Wide enough to read "curing salt no. 1 (6.25 % nitrite)" whole.
const NAME_MIN = 260;
const NARROW = 48;
const ALLERGENS_WIDTH = 220;

/**
 * The ingredients of a formula as an editable table: name and percentage, plus the columns of the
 * formula's kind (what a curing salt holds; flour, water content and yeast of a dough; the base of
 * a mix) and allergens. Rows can be added and removed unless the table is read-only.
 */
@Component({
  selector: 'app-ingredient-table',
  imports: [
    ReactiveFormsModule,
    MatFormField,
    MatInput,
    MatSelect,
    MatOption,
    MatCheckbox,
    MatRadioButton,
    MatButton,
    MatIconButton,
    MatIcon,
  ],
  templateUrl: './ingredient-table.html',
  styleUrl: './ingredient-table.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class IngredientTable {
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly injector = inject(Injector);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);

  /** The ingredient rows. */
  readonly rows = input.required<FormArray<IngredientRow>>();
  /** The formula's kind: decides the columns. */
  readonly kind = input.required<FormulaKind>();
  /** Heading of the percentage column, e.g. "% of green weight". */
  readonly pctHeading = input('%');
  /** Caption of the table, for screen readers (a visible heading usually stands above it). */
  readonly caption = input('Ingredients');
  /** A line shown above the table, such as how to pick the base. */
  readonly hint = input<string | null>(null);
  /** Whether the rows can only be read. */
  readonly readOnly = input(false);

  protected readonly uid = `ingredients-${nextId++}`;
  /** The first column: the base of a mix, or whether a dough ingredient is flour. */
  protected readonly lead = computed(() =>
    this.kind() === 'mix' ? 'base' : this.kind() === 'dough' ? 'flour' : null,
  );
  protected readonly columns = computed((): readonly Column[] => [
    { key: 'pct', label: this.pctHeading(), ...NUMBER },
    ...OWN_COLUMNS[this.kind()],
  ]);
  protected readonly minWidth = computed(
    () =>
      NAME_MIN +
      ALLERGENS_WIDTH +
      this.columns().reduce((sum, column) => sum + column.width, 0) +
      (this.lead() ? NARROW : 0) +
      (this.readOnly() ? 0 : NARROW),
  );
  protected readonly columnCount = computed(
    () => this.columns().length + 2 + (this.lead() ? 1 : 0) + (this.readOnly() ? 0 : 1),
  );
  protected readonly rowList = watchControl(this.rows, (rows) => [...rows.controls]);

  protected addRow(): void {
    this.rows().push(ingredientRow(this.fb));
    afterNextRender(
      () => {
        const names = this.host.nativeElement.querySelectorAll<HTMLInputElement>('input.name');
        names.item(names.length - 1)?.focus();
      },
      { injector: this.injector },
    );
  }

  protected removeRow(index: number): void {
    this.rows().removeAt(index);
  }

  protected makeBase(index: number): void {
    this.rows().controls.forEach((row, i) =>
      row.controls.base.setValue(i === index, { emitEvent: false }),
    );
    this.rows().updateValueAndValidity();
  }

  protected rowName(row: IngredientRow, index: number): string {
    return row.controls.name.value.trim() || `row ${index + 1}`;
  }
}
