import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatIconButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatListItem, MatListItemIcon, MatListItemTitle, MatNavList } from '@angular/material/list';
import { MatMenu, MatMenuItem, MatMenuTrigger } from '@angular/material/menu';
import { MatSidenav, MatSidenavContainer, MatSidenavContent } from '@angular/material/sidenav';
import { MatToolbar } from '@angular/material/toolbar';
import { MatTooltip } from '@angular/material/tooltip';
import { NavigationEnd, Router, RouterLink, RouterOutlet } from '@angular/router';
import { filter, map } from 'rxjs';
import { Role } from '../../api/api-types';
import { SessionStore } from '../../auth/session-store';
import { SitePicker } from '../../sites/site-picker/site-picker';

/** One area of the console in the left navigation. */
interface Area {
  readonly path: string;
  /** Query parameters of the link, for an area that is a view of another (the queue). */
  readonly query?: Readonly<Record<string, string>>;
  readonly label: string;
  readonly icon: string;
  /** Roles that see it; all when absent. */
  readonly roles?: readonly Role[];
}

const AREAS: readonly Area[] = [
  { path: '/today', label: 'Today', icon: 'today' },
  { path: '/batches', label: 'Batch log', icon: 'list_alt' },
  {
    path: '/batches',
    query: { show: 'sign-off' },
    label: 'To sign off',
    icon: 'pending_actions',
    roles: ['admin', 'reviewer'],
  },
  { path: '/formulas', label: 'Formulas', icon: 'menu_book' },
  { path: '/plans', label: 'Plans', icon: 'event' },
  { path: '/equipment', label: 'Equipment', icon: 'kitchen' },
  { path: '/deliveries', label: 'Deliveries', icon: 'local_shipping' },
  { path: '/trace', label: 'Trace', icon: 'account_tree' },
  { path: '/reports', label: 'HACCP report', icon: 'fact_check', roles: ['admin', 'reviewer'] },
  { path: '/costing', label: 'Least-cost blend', icon: 'calculate', roles: ['admin', 'reviewer'] },
  { path: '/people', label: 'People', icon: 'group', roles: ['admin'] },
];

const ROLE_NAMES: Record<Role, string> = { admin: 'Admin', cook: 'Cook', reviewer: 'Reviewer' };

/** The console's frame: one left navigation with the areas, and who is signed in. */
@Component({
  selector: 'app-shell',
  imports: [
    RouterOutlet,
    RouterLink,
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
    SitePicker,
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

  /** The address shown, after redirects. */
  private readonly url = toSignal(
    this.router.events.pipe(
      filter((event) => event instanceof NavigationEnd),
      map((event) => event.urlAfterRedirects),
    ),
    { initialValue: this.router.url },
  );
  /**
   * The area the page belongs to: the one whose path holds the address and whose query matches
   * it, the most particular first — the sign-off queue before the batch log it is a view of.
   */
  protected readonly activeArea = computed(() => {
    const tree = this.router.parseUrl(this.url());
    const path = `/${tree.root.children['primary']?.segments.map((s) => s.path).join('/') ?? ''}`;
    const query = tree.queryParams as Record<string, string | undefined>;
    const fits = (area: Area): boolean =>
      (path === area.path || path.startsWith(`${area.path}/`)) &&
      Object.entries(area.query ?? {}).every(([key, value]) => query[key] === value);
    const weight = (area: Area): number => Object.keys(area.query ?? {}).length;
    return (
      this.areas()
        .filter(fits)
        .sort((a, b) => weight(b) - weight(a))[0] ?? null
    );
  });

  /** Counts site changes: the page's outlet is made afresh on each. */
  protected readonly outletRound = signal(0);

  /**
   * The site changed: the page shows the new site's records. A record's own page (a batch, a
   * delivery) belonged to the site left, so its list is shown instead; any other page is made
   * afresh where it is, with its filters.
   */
  protected async siteChanged(): Promise<void> {
    const tree = this.router.parseUrl(this.router.url);
    const segments = tree.root.children['primary']?.segments ?? [];
    if (segments.length > 1) await this.router.navigateByUrl(`/${segments[0].path}`);
    else this.outletRound.update((round) => round + 1);
  }

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
