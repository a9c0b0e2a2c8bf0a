import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import type { AcceptedInvitation } from '../../../shared/api/seats';
import { AuthService } from '../core/auth.service';
import { problemDisplay, problemMessage } from '../core/problem';

/**
 * `/invitations/accept?token=…`, the link in a shop's invitation e-mail: signed in with the invited
 * address, the apprentice takes the seat with one button; otherwise the page says how to sign in or
 * create the account first, and brings them back here.
 */
@Component({
  selector: 'fl-accept-invitation-page',
  imports: [MatButton, RouterLink],
  template: `
    <h1>Your invitation</h1>
    @if (!token()) {
      <p role="alert">This link has no invitation in it. Open the link from the invitation e-mail again.</p>
    } @else if (accepted(); as a) {
      <div role="status">
        <p>You have a seat at <strong>{{ a.shop.name }}</strong>. Every lesson and quiz is open to you.</p>
        <p><a matButton="filled" routerLink="/course">Go to the course</a></p>
      </div>
    } @else if (auth.user(); as user) {
      <p class="lead">A shop has invited you to take one of its seats on Flowlore. You are signed in as {{ user.email }}.</p>
      <button matButton="filled" type="button" [disabled]="busy()" (click)="accept()">Accept the seat</button>
      <div role="alert" class="problem">
        @if (problem(); as p) {
          <p>{{ p }}</p>
        }
      </div>
    } @else if (auth.known()) {
      <p class="lead">A shop has invited you to take one of its seats on Flowlore.</p>
      <p>Sign in with the address the invitation was sent to. No account yet? Create one with that address, confirm it from the e-mail we send, then open the invitation link again.</p>
      <p class="actions">
        <a matButton="filled" routerLink="/account/sign-in" [queryParams]="{ returnUrl: here() }">Sign in</a>
        <a matButton="outlined" routerLink="/account/sign-up">Create an account</a>
      </p>
    } @else {
      <p role="status">Checking who is signed in…</p>
    }
  `,
  styles: `
    .lead,
    p {
      max-width: 60ch;
    }

    .actions {
      display: flex;
      gap: 1rem;
      flex-wrap: wrap;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AcceptInvitationPage {
  /** From the link's query (`?token=`). */
  readonly token = input<string | undefined>(undefined);

  private readonly http = inject(HttpClient);
  private readonly router = inject(Router);
  protected readonly auth = inject(AuthService);
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly accepted = signal<AcceptedInvitation | null>(null);

  protected here(): string {
    return this.router.url;
  }

  protected async accept(): Promise<void> {
    this.busy.set(true);
    this.problem.set(null);
    try {
      this.accepted.set(await firstValueFrom(this.http.post<AcceptedInvitation>('/api/invitations/accept', { token: this.token() }, { context: problemDisplay('page') })));
    } catch (error) {
      this.problem.set(problemMessage(error, 'The invitation could not be accepted. Try again in a moment.'));
    } finally {
      this.busy.set(false);
    }
  }
}
