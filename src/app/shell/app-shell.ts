import { BreakpointObserver } from '@angular/cdk/layout';
import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatSidenav, MatSidenavContainer, MatSidenavContent } from '@angular/material/sidenav';
import { MatToolbar } from '@angular/material/toolbar';
import { type ActivatedRouteSnapshot, NavigationEnd, Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { filter, map } from 'rxjs';

import type { Role } from '../../../shared/api/accounts';
import { AuthService } from '../core/auth.service';
import { ConnectivityService } from '../core/connectivity.service';
import { UnreadNotifications } from '../core/unread-notifications';

import { NeedsConnection } from './needs-connection';

import { SiteFooter } from './site-footer';
import { ThemeMenu } from './theme-menu';
import { UserMenu } from './user-menu';

// Below Material's "medium" window class (840px) the links move into a drawer: phones and
// shop-floor tablets held upright.
const narrowQuery = '(max-width: 839.98px)';

interface NavLink {
  readonly path: string;
  readonly label: string;
}

// The pages each role works in, after the ones everybody has.
const ROLE_LINKS: Readonly<Partial<Record<Role, readonly NavLink[]>>> = {
  admin: [{ path: '/admin', label: 'Admin' }],
  instructor: [
    { path: '/cohorts', label: 'Cohorts' },
    { path: '/grading', label: 'Grading' },
  ],
  shop_owner: [{ path: '/shop', label: 'My shop' }],
};

/** The frame around every page: top bar, main navigation, the page itself, footer. */
@Component({
  selector: 'fl-root',
  imports: [
    MatButton,
    MatIcon,
    MatIconButton,
    MatSidenav,
    MatSidenavContainer,
    MatSidenavContent,
    MatToolbar,
    NeedsConnection,
    NgTemplateOutlet,
    RouterLink,
    RouterLinkActive,
    RouterOutlet,
    SiteFooter,
    ThemeMenu,
    UserMenu,
  ],
  templateUrl: './app-shell.html',
  styleUrl: './app-shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AppShell {
  private readonly breakpoints = inject(BreakpointObserver);
  private readonly router = inject(Router);
  protected readonly auth = inject(AuthService);
  protected readonly online = inject(ConnectivityService).online;
  protected readonly unread = inject(UnreadNotifications).unread;
  /** The bell's name says the count; the figure on it is for the eye only. */
  protected readonly bellLabel = computed(() => {
    const count = this.unread();
    return count === 0 ? 'Notifications' : `Notifications: ${count} unread`;
  });

  /** Whether the page on screen works only with the server (its route says `needsConnection`). */
  private readonly pageNeedsConnection = toSignal(
    this.router.events.pipe(
      filter((event) => event instanceof NavigationEnd),
      map(() => needsConnection(this.router.routerState.snapshot.root)),
    ),
    { initialValue: false },
  );

  /** Offline on such a page: say so instead of showing a form that cannot be sent. */
  protected readonly blockedOffline = computed(() => !this.online() && this.pageNeedsConnection());

  private readonly everyone: readonly NavLink[] = [
    { path: '/course', label: 'Course' },
    { path: '/calculators', label: 'Calculators' },
  ];

  /** The top bar's and the drawer's links: the same list, with the signed-in role's pages added. */
  protected readonly sections = computed<readonly NavLink[]>(() => {
    const role = this.auth.role();
    return role ? [...this.everyone, ...(ROLE_LINKS[role] ?? [])] : this.everyone;
  });

  protected readonly narrow = toSignal(
    this.breakpoints.observe(narrowQuery).pipe(map((state) => state.matches)),
    { initialValue: this.breakpoints.isMatched(narrowQuery) },
  );

  /** Whether the navigation drawer is open; it closes whenever the layout changes. */
  protected readonly drawerOpen = linkedSignal({ source: this.narrow, computation: () => false });

  protected async signOut(): Promise<void> {
    this.drawerOpen.set(false);
    await this.auth.signOut();
    await this.router.navigateByUrl('/');
  }

  /** The app uses <base href="/">, so a bare "#content" link would leave the page: move focus instead. */
  protected skipToContent(event: Event, main: HTMLElement): void {
    event.preventDefault();
    main.focus();
    main.scrollIntoView();
  }
}

function needsConnection(route: ActivatedRouteSnapshot): boolean {
  return route.data['needsConnection'] === true || route.children.some(needsConnection);
}
