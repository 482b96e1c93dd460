import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatIconButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatListItem, MatListItemIcon, MatListItemTitle, MatNavList } from '@angular/material/list';
import { MatMenu, MatMenuItem, MatMenuTrigger } from '@angular/material/menu';
import { MatSidenav, MatSidenavContainer, MatSidenavContent } from '@angular/material/sidenav';
import { MatToolbar } from '@angular/material/toolbar';
import { MatTooltip } from '@angular/material/tooltip';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';
import { Role } from '../../api/api-types';
import { SessionStore } from '../../auth/session-store';

/** One area of the console in the left navigation. */
interface Area {
  readonly path: string;
  readonly label: string;
  readonly icon: string;
  /** Roles that see it; all when absent. */
  readonly roles?: readonly Role[];
}

const AREAS: readonly Area[] = [
  { path: '/formulas', label: 'Formulas', icon: 'menu_book' },
  { path: '/plans', label: 'Plans', icon: 'event' },
  { path: '/batches', label: 'Batch log', icon: 'list_alt' },
  { path: '/curing', label: 'Curing now', icon: 'hourglass_top' },
  { path: '/equipment', label: 'Equipment', icon: 'kitchen' },
  { path: '/reports', label: 'HACCP report', icon: 'fact_check', roles: ['admin', 'reviewer'] },
  { path: '/people', label: 'People', icon: 'group', roles: ['admin'] },
];

const ROLE_NAMES: Record<Role, string> = { admin: 'Admin', cook: 'Cook', reviewer: 'Reviewer' };

/** The console's frame: one left navigation with the areas, and who is signed in. */
@Component({
  selector: 'app-shell',
  imports: [
    RouterOutlet,
    RouterLink,
    RouterLinkActive,
    MatToolbar,
    MatIcon,
    MatMenu,
    MatMenuItem,
    MatMenuTrigger,
    MatIconButton,
    MatTooltip,
    MatSidenav,
    MatSidenavContainer,
    MatSidenavContent,
    MatNavList,
    MatListItem,
    MatListItemIcon,
    MatListItemTitle,
  ],
  templateUrl: './shell.html',
  styleUrl: './shell.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class Shell {
  private readonly session = inject(SessionStore);
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);

  /** Whether the screen is narrow (a phone, a tablet held upright): the navigation slides over. */
  protected readonly narrow = toSignal(
    inject(BreakpointObserver)
      .observe('(max-width: 840px)')
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  protected readonly person = this.session.person;
  protected readonly roleName = computed(() => {
    const role = this.person()?.role;
    return role ? ROLE_NAMES[role] : '';
  });
  protected readonly areas = computed(() => {
    const role = this.person()?.role;
    return AREAS.filter((area) => !area.roles || (role !== undefined && area.roles.includes(role)));
  });

  protected async changePassword(): Promise<void> {
    const { openChangePassword } = await import('../../../account/change-password/change-password');
    openChangePassword(this.dialog);
  }

  protected async myReminders(): Promise<void> {
    const { openMyReminders } = await import('../../../account/my-reminders/my-reminders');
    openMyReminders(this.dialog);
  }

  protected async signOut(): Promise<void> {
    await this.session.signOut();
    await this.router.navigate(['/sign-in']);
  }
}
