import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatOption, MatSelect } from '@angular/material/select';
import type { SpeciesWord } from '../species-choices';
import { SPECIES } from '../formula-vocabulary';

/** The meat of a cure or blend, every meat of a mixture: it sets the cooking temperature. */
@Component({
  selector: 'app-species-field',
  imports: [ReactiveFormsModule, MatFormField, MatLabel, MatHint, MatSelect, MatOption],
  templateUrl: './species-field.html',
  styleUrl: '../formula-fields.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpeciesField {
  /** The species control of the formula's own group. */
  readonly control = input.required<FormControl<SpeciesWord[]>>();

  protected readonly species = SPECIES;
}
