import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { RouterLink } from '@angular/router';

/** What an unknown address shows. */
@Component({
  selector: 'app-not-found',
  imports: [RouterLink, MatButton],
  template: `
    <h1>Nothing here</h1>
    <p>This address is not part of Larderbook.</p>
    <a matButton="filled" routerLink="/batches">Go to the batch log</a>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class NotFound {}
