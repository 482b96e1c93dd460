import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import {
  FormControl,
  FormGroup,
  ReactiveFormsModule,
  Validators,
  type NonNullableFormBuilder,
} from '@angular/forms';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';

/** A temperature as a cook types it: the number on the thermometer and its scale. */
export type TemperatureForm = FormGroup<{
  value: FormControl<string>;
  unit: FormControl<'°C' | '°F'>;
}>;

/** A number as the thermometer shows it: a minus (either sign), digits, a point or comma. */
const NUMBER = /^\s*[-−]?\d+([.,]\d+)?\s*$/;

/** The controls of a temperature entry, required, in °C until the cook picks °F. */
export function temperatureForm(fb: NonNullableFormBuilder): TemperatureForm {
  return fb.group({
    value: ['', [Validators.required, Validators.pattern(NUMBER)]],
    unit: ['°C' as '°C' | '°F'],
  });
}

/** The entry as the API reads it ("-0.5 °C", "38 °F"), or null while it is not a number. */
export function temperatureText(value: string, unit: string): string | null {
  if (!NUMBER.test(value)) return null;
  return `${value.trim().replace('−', '-').replace(',', '.')} ${unit}`;
}

/**
 * One big number box and a °C/°F toggle, for a tablet at the unit: what a reading and an
 * ice-point check both ask for.
 */
@Component({
  selector: 'app-temperature-entry',
  imports: [
    ReactiveFormsModule,
    MatFormField,
    MatLabel,
    MatError,
    MatInput,
    MatButtonToggleGroup,
    MatButtonToggle,
  ],
  template: `
    <div class="reading-row" [formGroup]="form()">
      <mat-form-field class="big-field">
        <mat-label>{{ label() }}</mat-label>
        <input
          matInput
          formControlName="value"
          inputmode="decimal"
          autocomplete="off"
          required
          cdkFocusInitial
          [attr.data-testid]="testid()"
        />
        @if (form().controls.value.invalid) {
          <mat-error>Type the number the thermometer shows, e.g. {{ example() }}</mat-error>
        }
      </mat-form-field>
      <mat-button-toggle-group formControlName="unit" aria-label="Unit" class="unit">
        <mat-button-toggle value="°C">°C</mat-button-toggle>
        <mat-button-toggle value="°F">°F</mat-button-toggle>
      </mat-button-toggle-group>
    </div>
  `,
  styleUrl: '../equipment-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TemperatureEntry {
  readonly form = input.required<TemperatureForm>();
  readonly label = input('Temperature');
  readonly example = input('3.5');
  readonly testid = input.required<string>();
}
