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
import { MatOptgroup, MatOption } from '@angular/material/core';
import { MatFormField, MatHint, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatSelect } from '@angular/material/select';
import type { FormulaKind } from '../formula-api-types';
import {
  COUNT_KEYS,
  KEY_HINTS,
  quantityChoices,
  quantityKeyFor,
  takesSizes,
  type QuantityKey,
} from '../assembly-quantity';
import { AssemblyPartRow, assemblyPartRow } from '../formula-form-model';
import { FormulaStore } from '../formula-store';
import { watchControl } from '../watch-control';

let nextId = 0;

/** The kinds in the order the formula select groups them, with the group's heading. */
const GROUPS: readonly { kind: FormulaKind; label: string }[] = [
  { kind: 'blend', label: 'Blends' },
  { kind: 'dough', label: 'Doughs' },
  { kind: 'cure', label: 'Cures' },
  { kind: 'mix', label: 'Mixes' },
  { kind: 'assembly', label: 'Assemblies' },
];

/** The text cells after the quantity: a cure's slice weight (with slices) and its sizes. */
const SIZE_CELLS = [
  {
    key: 'slice',
    heading: 'Slice weight',
    label: 'Weight of one slice',
    example: '25 g',
    testId: 'part-slice',
  },
  {
    key: 'thickness',
    heading: 'Thickness',
    label: 'Thickness, for the hold',
    example: '4 cm',
    testId: 'part-thickness',
  },
  {
    key: 'largest_piece',
    heading: 'Heaviest piece',
    label: 'Heaviest piece, for the hold',
    example: '2.5 kg',
    testId: 'part-largest-piece',
  },
] as const;

/** A formula a part can name. */
interface Named {
  readonly id: string;
  readonly title: string;
  readonly kind: FormulaKind;
  readonly valid: boolean;
}

/**
 * An assembly's parts as an editable table: each row names a formula of the library (grouped by
 * kind) and how much of it goes into one unit, with the quantity keys that fit the formula's kind
 * (portions of a blend, pieces of a dough, slices of a cure with the slice weight, a finished
 * weight of any batch kind, units of another assembly, a percent of the green weight of another
 * part it goes on, such as a rub on a brisket), and for a cure the sizes its hold rule goes by. Rows can be added and removed unless the table is read-only.
 */
@Component({
  selector: 'app-assembly-parts',
  imports: [
    ReactiveFormsModule,
    MatFormField,
    MatHint,
    MatSuffix,
    MatInput,
    MatSelect,
    MatOption,
    MatOptgroup,
    MatButton,
    MatIconButton,
    MatIcon,
  ],
  templateUrl: './assembly-parts.html',
  styleUrls: ['../ingredient-table/ingredient-table.css', './assembly-parts.css'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AssemblyParts {
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly injector = inject(Injector);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  protected readonly store = inject(FormulaStore);

  /** The parts. */
  readonly rows = input.required<FormArray<AssemblyPartRow>>();
  /** The assembly's own id: it cannot be a part of itself. */
  readonly selfId = input<string | null>(null);
  /** Whether the rows can only be read. */
  readonly readOnly = input(false);

  protected readonly uid = `parts-${nextId++}`;
  protected readonly hints = KEY_HINTS;
  protected readonly sizeCells = SIZE_CELLS;
  /** The formulas a part can name, by id. */
  private readonly library = computed(() => {
    const named = new Map<string, Named>();
    for (const item of this.store.formulas() ?? []) {
      if (item.id === null || item.kind === null || item.duplicate) continue;
      if (item.id === this.selfId()) continue;
      named.set(item.id, {
        id: item.id,
        title: item.title ?? item.id,
        kind: item.kind,
        valid: item.valid,
      });
    }
    return named;
  });
  /** The formula select's groups, each by title. */
  protected readonly groups = computed(() => {
    const all = [...this.library().values()].sort((a, b) => a.title.localeCompare(b.title));
    return GROUPS.map((group) => ({
      ...group,
      formulas: all.filter((formula) => formula.kind === group.kind),
    })).filter((group) => group.formulas.length > 0);
  });
  /** Each row with what its cells depend on: the named formula's kind and the quantity key. */
  protected readonly parts = watchControl(this.rows, (rows) =>
    rows.controls.map((row, i) => {
      const { formula, quantity, on } = row.getRawValue();
      const named = this.library().get(formula) ?? null;
      // What a part applied to another (pct) can go on: the other parts of this assembly.
      const others = rows.controls
        .map((other) => other.controls.formula.value)
        .filter((id, j, all) => id !== '' && id !== formula && all.indexOf(id) === j);
      const bases = [...others, ...(on !== '' && !others.includes(on) ? [on] : [])].map((id) => ({
        id,
        title: this.library().get(id)?.title ?? `${id} (not a part of this assembly)`,
      }));
      const kind = named?.kind ?? null;
      const choices = quantityChoices(kind);
      return {
        row,
        label: named?.title ?? (formula || `part ${i + 1}`),
        // A formula that is not (or no longer) in the library is still shown, and said so.
        missing: formula !== '' && this.store.formulas() !== null && !named,
        invalid: named !== null && !named.valid,
        byCount: COUNT_KEYS.includes(quantity),
        applied: quantity === 'pct',
        bases,
        sliced: quantity === 'slices',
        sized: takesSizes(kind, quantity),
        choices: choices.some((choice) => choice.value === quantity)
          ? choices
          : [...choices, { value: quantity, label: `${quantity} (does not fit)` }],
      };
    }),
  );

  constructor() {
    if (this.store.formulas() === null && !this.store.loading()) void this.store.loadList();
  }

  /** A formula was chosen: the quantity follows its kind, and a cure's sizes go if it is none. */
  protected chooseFormula(row: AssemblyPartRow): void {
    const { formula, quantity, count } = row.getRawValue();
    const kind = this.library().get(formula)?.kind ?? null;
    const key: QuantityKey = quantityKeyFor(kind, quantity);
    if (key !== quantity) row.controls.quantity.setValue(key);
    if (COUNT_KEYS.includes(key) && count === null) row.controls.count.setValue(1);
    if (kind !== null && kind !== 'cure') {
      row.controls.thickness.setValue('');
      row.controls.largest_piece.setValue('');
    }
  }

  protected addRow(): void {
    this.rows().push(assemblyPartRow(this.fb));
    afterNextRender(
      () => {
        const selects = this.host.nativeElement.querySelectorAll<HTMLElement>('.part-formula');
        selects.item(selects.length - 1)?.focus();
      },
      { injector: this.injector },
    );
  }

  protected removeRow(index: number): void {
    this.rows().removeAt(index);
  }
}
