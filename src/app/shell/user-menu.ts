import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatMenu, MatMenuItem, MatMenuTrigger } from '@angular/material/menu';
import { Router, RouterLink } from '@angular/router';

import { AuthService } from '../core/auth.service';

/** The top bar's account control: "Sign in" for a visitor, else a menu under the user's name. */
@Component({
  selector: 'fl-user-menu',
  imports: [MatButton, MatMenu, MatMenuItem, MatMenuTrigger, RouterLink],
  template: `
    @if (auth.user(); as user) {
      <button matButton type="button" class="trigger" [matMenuTriggerFor]="menu"
              [attr.aria-label]="'Account: ' + user.displayName">
        <span class="name">{{ user.displayName }}</span>
        <svg class="chevron" viewBox="0 0 24 24" aria-hidden="true" focusable="false"><path d="M7 10l5 5 5-5" /></svg>
      </button>
      <mat-menu #menu="matMenu" xPosition="before">
        @if (user.role === 'apprentice') {
          <a mat-menu-item routerLink="/progress">My progress</a>
        }
        <a mat-menu-item routerLink="/account/profile">Profile</a>
        <button mat-menu-item type="button" (click)="signOut()">Sign out</button>
      </mat-menu>
    } @else if (auth.known()) {
      <a matButton="outlined" routerLink="/account/sign-in">Sign in</a>
    }
  `,
  styles: `
    .chevron {
      width: 1.25rem;
      height: 1.25rem;
      margin-inline-start: 0.125rem;
      vertical-align: middle;
      fill: none;
      stroke: currentColor;
      stroke-width: 2;
      stroke-linecap: round;
      stroke-linejoin: round;
    }

    .name {
      display: inline-block;
      max-width: 12rem;
      overflow: hidden;
      text-overflow: ellipsis;
      white-space: nowrap;
      vertical-align: bottom;
    }
  `,
  host: { class: 'no-print' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UserMenu {
  private readonly router = inject(Router);
  protected readonly auth = inject(AuthService);

  protected async signOut(): Promise<void> {
    await this.auth.signOut();
    await this.router.navigateByUrl('/');
  }
}
