import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import {
  FormArray,
  FormControl,
  FormGroup,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
} from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatOption } from '@angular/material/core';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSelect } from '@angular/material/select';
import { map } from 'rxjs';
import { messageOf } from '../../core/api/message-of';
import {
  CostApi,
  type BlendStandard,
  type BlendTrimRecord,
  type LeastCostAnswer,
} from '../cost-api';

/** One trim's row of the form. */
type TrimForm = FormGroup<{
  name: FormControl<string>;
  fat: FormControl<number | null>;
  price: FormControl<number | null>;
  onHand: FormControl<string>;
  fatAsSuch: FormControl<boolean>;
}>;

/** The standards to choose from, with their rule in the words a manager reads. */
const STANDARDS: readonly { value: BlendStandard | 'none'; label: string; rule: string }[] = [
  {
    value: 'ground-beef',
    label: 'Ground beef: 30 % fat at most',
    rule: '9 CFR 319.15(a); no fat added as such',
  },
  { value: 'hamburger', label: 'Hamburger: 30 % fat at most', rule: '9 CFR 319.15(b)' },
  {
    value: 'fresh-pork-sausage',
    label: 'Fresh pork sausage: 50 % fat at most',
    rule: '9 CFR 319.141',
  },
  { value: 'none', label: 'No standard', rule: 'any fat the trims can make' },
];

/** Kilograms on hand as the field shows them: "20 kg", to the gram. */
function kgText(grams: string): string {
  const kg = Number(grams) / 1000;
  return `${Number(kg.toFixed(3))} kg`;
}

/**
 * The least-cost blend: the trims on hand (prefilled from the lots in stock, with their fat and
 * latest price, or typed in), a target fat, a batch size and the standard the grind is sold
 * under; the cheapest mix that makes it, as a table, or the reason it cannot be made. For admins
 * and reviewers, who see what the trims cost.
 */
@Component({
  selector: 'app-least-cost-blend',
  imports: [
    ReactiveFormsModule,
    MatFormField,
    MatLabel,
    MatHint,
    MatError,
    MatSuffix,
    MatInput,
    MatSelect,
    MatOption,
    MatCheckbox,
    MatButton,
    MatIconButton,
    MatIcon,
    MatProgressBar,
  ],
  templateUrl: './least-cost-blend.html',
  styleUrl: './least-cost-blend.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class LeastCostBlend {
  private readonly api = inject(CostApi);
  private readonly fb = inject(NonNullableFormBuilder);

  protected readonly standards = STANDARDS;
  protected readonly form = this.fb.group({
    target: this.fb.control<number | null>(20, [
      Validators.required,
      Validators.min(0),
      Validators.max(100),
    ]),
    batch: this.fb.control('50 kg', Validators.required),
    standard: this.fb.control<BlendStandard | 'none'>('ground-beef'),
    trims: this.fb.array<TrimForm>([]),
  });
  protected readonly standardRule = toSignal(
    this.form.controls.standard.valueChanges.pipe(
      map((value) => STANDARDS.find((s) => s.value === value)?.rule ?? ''),
    ),
    { initialValue: STANDARDS[0].rule },
  );
  protected readonly loading = signal(true);
  protected readonly working = signal(false);
  protected readonly stockError = signal<string | null>(null);
  protected readonly fromStock = signal(0);
  protected readonly answer = signal<LeastCostAnswer | null>(null);
  protected readonly refusal = signal<string | null>(null);

  constructor() {
    void this.prefill();
  }

  protected get trims(): FormArray<TrimForm> {
    return this.form.controls.trims;
  }

  private trimRow(trim?: BlendTrimRecord): TrimForm {
    return this.fb.group({
      name: this.fb.control(trim?.name ?? '', Validators.required),
      fat: this.fb.control<number | null>(trim ? Number(trim.fat) : null, [
        Validators.required,
        Validators.min(0),
        Validators.max(100),
      ]),
      price: this.fb.control<number | null>(
        trim?.pricePerKg === undefined || trim.pricePerKg === null ? null : Number(trim.pricePerKg),
        [Validators.required, Validators.min(0)],
      ),
      onHand: this.fb.control(trim ? kgText(trim.onHandGrams) : '', Validators.required),
      fatAsSuch: this.fb.control(trim?.fatAsSuch ?? false),
    });
  }

  private async prefill(): Promise<void> {
    try {
      const trims = await this.api.trims();
      for (const trim of trims) this.trims.push(this.trimRow(trim));
      this.fromStock.set(trims.length);
    } catch (error) {
      this.stockError.set(messageOf(error));
    } finally {
      if (this.trims.length === 0) this.trims.push(this.trimRow());
      this.loading.set(false);
    }
  }

  protected addTrim(): void {
    this.trims.push(this.trimRow());
  }

  protected removeTrim(index: number): void {
    this.trims.removeAt(index);
  }

  protected async work(): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const value = this.form.getRawValue();
    this.working.set(true);
    this.refusal.set(null);
    this.answer.set(null);
    try {
      this.answer.set(
        await this.api.leastCost({
          target: value.target ?? 0,
          batch: value.batch,
          ...(value.standard === 'none' ? {} : { standard: value.standard }),
          trims: value.trims.map((trim) => ({
            name: trim.name,
            fat: trim.fat ?? 0,
            price: trim.price ?? 0,
            onHand: trim.onHand,
            ...(trim.fatAsSuch ? { fatAsSuch: true } : {}),
          })),
        }),
      );
    } catch (error) {
      this.refusal.set(messageOf(error, undefined, 'sentence'));
    } finally {
      this.working.set(false);
    }
  }
}
