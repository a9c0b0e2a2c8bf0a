import { DatePipe } from '@angular/common';
import { HttpClient, httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, effect, inject, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { Router, RouterLink, type UrlTree } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import type { MarkReadRequest, NotificationsPage as Page, NotificationView, UnreadCount } from '../../../shared/api/notifications';
import { problemMessage } from '../core/problem';
import { UnreadNotifications } from '../core/unread-notifications';

/**
 * `/notifications`: the signed-in user's notices, newest first (a grade, a changed mark). New ones
 * say "New" in words; opening one marks it read; "Mark all as read" clears the bell.
 */
@Component({
  selector: 'fl-notifications-page',
  imports: [DatePipe, MatButton, RouterLink],
  template: `
    <h1>Notifications</h1>
    @if (page.hasValue()) {
      <div class="actions">
        <p class="count" role="status">{{ unread() === 0 ? 'No unread notifications.' : unread() + ' unread.' }}</p>
        <button matButton="outlined" type="button" [disabled]="unread() === 0 || busy()" (click)="markAll()">Mark all as read</button>
      </div>
      @if (items().length === 0) {
        <p class="empty">Nothing here yet. When an instructor grades one of your answers or changes a mark, you will find it here and in your e-mail.</p>
      } @else {
        <ul class="list" aria-label="Your notifications">
          @for (notice of items(); track notice.id) {
            <li class="notice" [class.unread]="!notice.readAt">
              <p class="head">
                @if (!notice.readAt) {
                  <span class="new">New</span>
                }
                @if (notice.link) {
                  <a [routerLink]="notice.tree" (click)="open($event, notice)">{{ notice.title }}</a>
                } @else {
                  <span class="title">{{ notice.title }}</span>
                }
              </p>
              <p class="body">{{ notice.body }}</p>
              <p class="when figures"><time [attr.datetime]="notice.createdAt">{{ notice.createdAt | date: 'yyyy-MM-dd HH:mm' }}</time></p>
            </li>
          }
        </ul>
      }
    } @else if (page.error()) {
      <p role="alert">{{ problem() }} <button matButton type="button" (click)="page.reload()">Try again</button></p>
    } @else {
      <p role="status">Loading your notifications…</p>
    }
  `,
  styles: `
    .actions {
      display: flex;
      flex-wrap: wrap;
      gap: 1rem;
      align-items: center;
      margin-block-end: 1rem;
    }

    .count,
    .empty {
      margin: 0;
      max-width: 68ch;
    }

    .list {
      max-width: 68ch;
      margin: 0;
      padding: 0;
      list-style: none;
    }

    .notice {
      padding: 0.75rem 1rem;
      border-inline-start: 4px solid transparent;
      border-bottom: 1px solid var(--mat-sys-outline-variant);

      &.unread {
        border-inline-start-color: var(--mat-sys-primary);
        background: var(--mat-sys-surface-container-low);
      }

      p {
        margin: 0.25rem 0;
      }
    }

    .head {
      font-weight: 600;
    }

    .new {
      display: inline-block;
      margin-inline-end: 0.5rem;
      padding: 0 0.5rem;
      border-radius: var(--mat-sys-corner-small);
      background: var(--mat-sys-primary);
      color: var(--mat-sys-on-primary);
      font: var(--mat-sys-label-medium);
      font-weight: 600;
    }

    .when {
      color: var(--mat-sys-on-surface-variant);
      font-size: 0.875rem;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotificationsPage {
  private readonly http = inject(HttpClient);
  private readonly router = inject(Router);
  private readonly bell = inject(UnreadNotifications);
  protected readonly page = httpResource<Page>(() => '/api/notifications?limit=50');
  /** Marked read here since the page loaded (the list is not fetched again for it). */
  private readonly readHere = signal<ReadonlySet<string>>(new Set());
  protected readonly busy = signal(false);

  protected readonly items = computed<Array<NotificationView & { tree: UrlTree | null }>>(() => {
    const read = this.readHere();
    return (this.page.value()?.items ?? []).map((n) => ({
      ...n,
      readAt: n.readAt ?? (read.has(n.id) ? new Date().toISOString() : null),
      tree: n.link ? this.router.parseUrl(n.link) : null,
    }));
  });
  protected readonly unread = signal(0);
  protected readonly problem = computed(() => problemMessage(this.page.error()));

  constructor() {
    effect(() => {
      const page = this.page.value();
      if (page) {
        this.unread.set(page.unread);
        this.bell.set(page.unread);
      }
    });
  }

  /** Opening a notice marks it read first (so the count is right on the page it leads to). */
  protected async open(event: MouseEvent, notice: NotificationView & { tree: UrlTree | null }): Promise<void> {
    if (notice.readAt || event.ctrlKey || event.metaKey || event.shiftKey || event.button !== 0) return;
    event.preventDefault();
    await this.markRead({ ids: [notice.id] }, [notice.id]);
    if (notice.tree) await this.router.navigateByUrl(notice.tree);
  }

  protected async markAll(): Promise<void> {
    await this.markRead({ all: true }, this.items().map((n) => n.id));
  }

  private async markRead(request: MarkReadRequest, ids: readonly string[]): Promise<void> {
    this.busy.set(true);
    try {
      const { unread } = await firstValueFrom(this.http.post<UnreadCount>('/api/notifications/read', request));
      this.readHere.update((read) => new Set([...read, ...ids]));
      this.unread.set(unread);
      this.bell.set(unread);
    } catch {
      // The interceptor has said why (a snackbar); the list stays as it was.
    } finally {
      this.busy.set(false);
    }
  }
}
