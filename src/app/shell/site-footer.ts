import { ChangeDetectionStrategy, Component } from '@angular/core';

/** The footer on every page: the safety notice, then who made this and when. */
@Component({
  selector: 'fl-site-footer',
  templateUrl: './site-footer.html',
  styleUrl: './site-footer.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SiteFooter {
  protected readonly year = new Date().getFullYear();
}
