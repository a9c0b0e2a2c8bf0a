import { ChangeDetectionStrategy, Component, ElementRef, Injector, afterNextRender, inject, input, signal, viewChild } from '@angular/core';
import { RouterLink } from '@angular/router';

import { AuthService } from '../core/auth.service';
import { focusAfterRender } from '../core/form-errors';
import { problemMessage } from '../core/problem';
import { AccountApi } from './account-api';

type Outcome = { state: 'checking' } | { state: 'verified' } | { state: 'failed'; message: string };

/** `/account/verify?token=…`: the link in the sign-up e-mail. Sends the token once and says how it went. */
@Component({
  selector: 'fl-verify-page',
  imports: [RouterLink],
  template: `
    <h1>Confirm your e-mail address</h1>
    @switch (outcome().state) {
      @case ('checking') {
        <p class="notice" role="status">Checking your link…</p>
      }
      @case ('verified') {
        <div class="notice" role="status" tabindex="-1" #result>
          <p><strong>Your e-mail address is confirmed.</strong></p>
          @if (auth.signedIn()) {
            <p>You are signed in. <a routerLink="/course">Go to the course</a></p>
          } @else {
            <p>You can now <a routerLink="/account/sign-in">sign in</a>.</p>
          }
        </div>
      }
      @case ('failed') {
        <div class="notice error" role="alert" tabindex="-1" #result>
          <p>{{ failure() }}</p>
          <p>
            You can still <a routerLink="/account/sign-in">sign in</a>. Choosing a new password through
            <a routerLink="/account/forgot-password">Forgot your password?</a> also confirms the address.
          </p>
        </div>
      }
    }
  `,
  styleUrl: './account-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VerifyPage {
  private readonly api = inject(AccountApi);
  private readonly injector = inject(Injector);
  private readonly result = viewChild<ElementRef<HTMLElement>>('result');
  protected readonly auth = inject(AuthService);

  readonly token = input<string>();
  protected readonly outcome = signal<Outcome>({ state: 'checking' });

  constructor() {
    // Once, after the inputs are set: the token works only once.
    afterNextRender(() => void this.check());
  }

  protected failure(): string {
    const outcome = this.outcome();
    return outcome.state === 'failed' ? outcome.message : '';
  }

  private async check(): Promise<void> {
    const token = this.token() ?? '';
    if (token.length < 16) {
      this.outcome.set({ state: 'failed', message: 'This page needs the link from your confirmation e-mail, complete. Open the link from the message again.' });
    } else {
      try {
        await this.api.verify(token);
        this.outcome.set({ state: 'verified' });
        await this.auth.whenKnown();
        if (this.auth.signedIn()) await this.auth.load();
      } catch (error) {
        this.outcome.set({ state: 'failed', message: problemMessage(error) });
      }
    }
    focusAfterRender(() => this.result()?.nativeElement, this.injector);
  }
}
