import { ChangeDetectionStrategy, Component } from '@angular/core';
import { RouterLink } from '@angular/router';

/** Shown for any address the app does not know. */
@Component({
  selector: 'fl-not-found-page',
  imports: [RouterLink],
  template: `
    <h1>Page not found</h1>
    <p class="prose">
      There is no page at this address. It may have moved, or the link may have a typing mistake
      in it. These will take you somewhere useful:
    </p>
    <ul class="prose">
      <li><a routerLink="/">The home page</a></li>
      <li><a routerLink="/course">The course</a></li>
      <li><a routerLink="/calculators">The calculators</a></li>
    </ul>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotFoundPage {}
