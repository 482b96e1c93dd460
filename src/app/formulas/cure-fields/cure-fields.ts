import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { CureGroup } from '../formula-form-model';
import { CURE_METHODS, CURE_PRODUCTS, HOLD_RULES } from '../formula-vocabulary';
import { SpeciesField } from '../species-field/species-field';
import { watchControl } from '../watch-control';

const RATE_LABELS: Record<string, string> = {
  days_per_cm: 'Days per cm',
  days_per_inch: 'Days per inch',
  days_per_kg: 'Days per kg',
  days_per_lb: 'Days per lb',
  days: 'Days',
};

/**
 * The fields only a cure has: method and product (which select the nitrite limit), the meat (which
 * sets the cooking temperature), how the brine
 * is made for brine and pump cures, and the kitchen's own hold rule.
 */
@Component({
  selector: 'app-cure-fields',
  imports: [
    ReactiveFormsModule,
    MatFormField,
    MatLabel,
    MatHint,
    MatInput,
    MatSelect,
    MatOption,
    SpeciesField,
  ],
  templateUrl: './cure-fields.html',
  styleUrl: '../formula-fields.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CureFields {
  /** The cure's own fields. */
  readonly group = input.required<CureGroup>();

  protected readonly methods = CURE_METHODS;
  protected readonly products = CURE_PRODUCTS;
  protected readonly holdRules = HOLD_RULES;
  protected readonly method = watchControl(this.group, (group) => group.controls.method.value);
  protected readonly holdRule = watchControl(this.group, (group) => group.controls.holdRule.value);
  protected readonly rateLabel = computed(() => RATE_LABELS[this.holdRule()] ?? 'Days');
}
