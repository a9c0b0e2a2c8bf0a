import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, inject, linkedSignal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatSidenav, MatSidenavContainer, MatSidenavContent } from '@angular/material/sidenav';
import { MatToolbar } from '@angular/material/toolbar';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';

import { SiteFooter } from './site-footer';
import { ThemeMenu } from './theme-menu';

// Below Material's "medium" window class (840px) the links move into a drawer: phones and
// shop-floor tablets held upright.
const narrowQuery = '(max-width: 839.98px)';

interface NavLink {
  readonly path: string;
  readonly label: string;
}

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
    RouterLink,
    RouterLinkActive,
    RouterOutlet,
    SiteFooter,
    ThemeMenu,
  ],
  templateUrl: './app-shell.html',
  styleUrl: './app-shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AppShell {
  private readonly breakpoints = inject(BreakpointObserver);

  protected readonly sections: readonly NavLink[] = [
    { path: '/course', label: 'Course' },
    { path: '/calculators', label: 'Calculators' },
  ];

  protected readonly narrow = toSignal(
    this.breakpoints.observe(narrowQuery).pipe(map((state) => state.matches)),
    { initialValue: this.breakpoints.isMatched(narrowQuery) },
  );

  /** Whether the navigation drawer is open; it closes whenever the layout changes. */
  protected readonly drawerOpen = linkedSignal({ source: this.narrow, computation: () => false });

  /** The app uses <base href="/">, so a bare "#content" link would leave the page: move focus instead. */
  protected skipToContent(event: Event, main: HTMLElement): void {
    event.preventDefault();
    main.focus();
    main.scrollIntoView();
  }
}
