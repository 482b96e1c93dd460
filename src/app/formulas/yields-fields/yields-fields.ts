import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { YieldsGroup } from '../formula-form-model';

/** Weight after each process step, % of the weight before it; empty steps are left out. */
@Component({
  selector: 'app-yields-fields',
  imports: [ReactiveFormsModule, MatFormField, MatLabel, MatInput],
  templateUrl: './yields-fields.html',
  styleUrl: '../formula-fields.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class YieldsFields {
  /** The yields fields. */
  readonly group = input.required<YieldsGroup>();

  protected readonly steps = [
    { key: 'trim', label: 'After trimming' },
    { key: 'cure', label: 'After curing' },
    { key: 'smoke', label: 'After smoking' },
    { key: 'cook', label: 'After cooking' },
    { key: 'slice', label: 'After slicing' },
  ] as const;
}
