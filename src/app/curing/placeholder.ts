import { ChangeDetectionStrategy, Component } from '@angular/core';

/** Placeholder until the feature lands. */
@Component({
  selector: 'app-curing-placeholder',
  template: '<h1>Curing now</h1>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class Placeholder {}
