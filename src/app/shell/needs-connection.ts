import { ChangeDetectionStrategy, Component } from '@angular/core';
import { RouterLink } from '@angular/router';

/**
 * Shown in place of a page that works only with the server (signing in, accounts, admin, cohorts,
 * shop) while the browser is offline. Nothing of those pages is ever served from the offline copy.
 */
@Component({
  selector: 'fl-needs-connection',
  imports: [RouterLink],
  template: `
    <section class="notice" aria-labelledby="needs-connection-title">
      <p class="kicker">Offline</p>
      <h1 id="needs-connection-title">This page needs a connection</h1>
      <p>
        Signing in, your account, and the cohort, shop and admin pages work with the Flowlore server, and this
        device has no network right now. Nothing you typed has been sent. The page comes back by itself when the
        connection does.
      </p>
      <p>
        Meanwhile the <a routerLink="/calculators">calculators</a> work offline, and so do the
        <a routerLink="/course">lessons</a> you have opened on this device.
      </p>
    </section>
  `,
  styles: `
    .notice {
      max-width: 40rem;
      margin: 3rem auto;
      padding-inline: 1.5rem;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NeedsConnection {}
