import { ChangeDetectionStrategy, Component } from '@angular/core';

/** Placeholder until the feature lands. */
@Component({
  selector: 'app-formulas-placeholder',
  template: '<h1>Formulas</h1>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class Placeholder {}
