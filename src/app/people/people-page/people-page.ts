import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatTabLink, MatTabNav, MatTabNavPanel } from '@angular/material/tabs';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';

/** The People area: who can sign in with which role, the audit log and the outbox, as tabs. */
@Component({
  selector: 'app-people-page',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatTabNav, MatTabLink, MatTabNavPanel],
  templateUrl: './people-page.html',
  styleUrl: './people-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class PeoplePage {
  protected readonly exact = { exact: true };
}
