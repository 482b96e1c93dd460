import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { BlendGroup } from '../formula-form-model';
import { STANDARDS } from '../formula-vocabulary';
import { SpeciesField } from '../species-field/species-field';
import { watchControl } from '../watch-control';

let nextId = 0;

/**
 * The fields only a blend has: the two trimmings with their fat (or chemical lean), the target,
 * the species and standard for the cooking caution and fat ceiling, and the portion weight.
 */
@Component({
  selector: 'app-blend-fields',
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
  templateUrl: './blend-fields.html',
  styleUrl: '../formula-fields.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BlendFields {
  /** The blend's own fields. */
  readonly group = input.required<BlendGroup>();

  protected readonly uid = `blend-${nextId++}`;
  protected readonly standards = STANDARDS;
  protected readonly components = watchControl(this.group, (group) => [
    ...group.controls.components.controls,
  ]);
}
