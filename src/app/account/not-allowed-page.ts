import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { RouterLink } from '@angular/router';

import { AuthService } from '../core/auth.service';
import { ROLE_LABELS } from './role-labels';

/** Where the role guards send a signed-in user whose role may not open a page. */
@Component({
  selector: 'fl-not-allowed-page',
  imports: [RouterLink],
  template: `
    <h1>Not allowed</h1>
    <p class="prose">
      @if (auth.role(); as role) {
        Your account ({{ roleLabels[role] }}) may not open
        @if (from(); as page) { <code>{{ page }}</code> } @else { that page }.
      } @else {
        Sign in with an account that may open that page.
      }
      If you think it should, ask an administrator.
    </p>
    <ul class="prose">
      <li><a routerLink="/course">The course</a></li>
      <li><a routerLink="/calculators">The calculators</a></li>
      <li><a routerLink="/account/profile">Your profile</a></li>
    </ul>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotAllowedPage {
  protected readonly auth = inject(AuthService);
  protected readonly roleLabels = ROLE_LABELS;
  /** The page that was refused (from the query string). */
  readonly from = input<string>();
}
