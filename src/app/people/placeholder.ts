import { ChangeDetectionStrategy, Component } from '@angular/core';

/** Placeholder until the feature lands. */
@Component({
  selector: 'app-people-placeholder',
  template: '<h1>People</h1>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class Placeholder {}
