import { ChangeDetectionStrategy, Component } from '@angular/core';
import { RouterLink } from '@angular/router';

/** Placeholder until accounts land. */
@Component({
  selector: 'fl-sign-in-page',
  imports: [RouterLink],
  template: `
    <h1>Sign in</h1>
    <p class="prose">
      Signing in is not open yet. Accounts for apprentices, instructors and shop owners are being
      prepared. You will not need one for the calculators.
    </p>
    <p class="prose"><a routerLink="/">Back to the home page</a></p>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignInPage {}
