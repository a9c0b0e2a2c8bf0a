import { HttpClient } from '@angular/common/http';
import { Injectable, effect, inject, signal } from '@angular/core';
import { NavigationEnd, Router } from '@angular/router';
import { filter, firstValueFrom } from 'rxjs';

import type { NotificationsPage } from '../../../shared/api/notifications';
import { AuthService } from './auth.service';
import { ConnectivityService } from './connectivity.service';
import { problemDisplay } from './problem';

/** How stale the count may get while someone moves between pages. */
const REFRESH_AFTER_MS = 60_000;

/**
 * The unread count on the top bar's bell: asked when someone signs in, on a page change once a
 * minute at most, and set at once by the notifications page. Quiet: a failure leaves the last count.
 */
@Injectable({ providedIn: 'root' })
export class UnreadNotifications {
  private readonly http = inject(HttpClient);
  private readonly auth = inject(AuthService);
  private readonly online = inject(ConnectivityService).online;
  private readonly count = signal(0);
  private askedAt = 0;

  readonly unread = this.count.asReadonly();

  constructor() {
    effect(() => {
      const user = this.auth.user();
      this.count.set(0);
      this.askedAt = 0;
      if (user) void this.refresh();
    });
    inject(Router)
      .events.pipe(filter((event) => event instanceof NavigationEnd))
      .subscribe(() => {
        if (this.auth.user() && Date.now() - this.askedAt > REFRESH_AFTER_MS) void this.refresh();
      });
  }

  /** Asks the server now. */
  async refresh(): Promise<void> {
    const user = this.auth.user();
    if (!user || !this.online()) return;
    this.askedAt = Date.now();
    try {
      const page = await firstValueFrom(this.http.get<NotificationsPage>('/api/notifications?limit=1', { context: problemDisplay('background') }));
      // An answer about someone who has since signed out is dropped.
      if (this.auth.user()?.id === user.id) this.count.set(page.unread);
    } catch {
      // The bell is a hint; the page itself says when something is wrong.
    }
  }

  /** What the server answered after a change on the notifications page. */
  set(unread: number): void {
    this.count.set(unread);
  }
}
