import { ChangeDetectionStrategy, Component } from '@angular/core';

/** Placeholder until the feature lands. */
@Component({
  selector: 'app-batches-placeholder',
  template: '<h1>Batch log</h1>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class Placeholder {}
