import { ChangeDetectionStrategy, Component, computed, inject, output } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatMenu, MatMenuItem, MatMenuTrigger } from '@angular/material/menu';
import { MatTooltip } from '@angular/material/tooltip';
import { Role } from '../../api/api-types';
import { SessionStore } from '../../auth/session-store';

const ROLE_NAMES: Record<Role, string> = { admin: 'Admin', cook: 'Cook', reviewer: 'Reviewer' };

/**
 * The site the console works at, in the top bar, on an install of several sites only: a menu of
 * the person's sites by name, with their role at each; a person of one site sees its name. A
 * single kitchen never sees it.
 */
@Component({
  selector: 'app-site-picker',
  imports: [MatButton, MatIcon, MatMenu, MatMenuItem, MatMenuTrigger, MatTooltip],
  templateUrl: './site-picker.html',
  styleUrl: './site-picker.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SitePicker {
  private readonly session = inject(SessionStore);

  /** A site was chosen other than the one worked at: its key (the store has it already). */
  readonly chosen = output<string>();

  protected readonly site = this.session.site;
  protected readonly sites = this.session.sites;
  protected readonly shown = computed(() => this.session.siteCount() > 1 && !!this.site());
  protected readonly roleName = (role: Role): string => ROLE_NAMES[role];

  protected choose(key: string): void {
    if (key === this.site()?.key) return;
    this.session.chooseSite(key);
    this.chosen.emit(key);
  }
}
