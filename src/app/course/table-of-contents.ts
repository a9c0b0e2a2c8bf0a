import { BreakpointObserver } from '@angular/cdk/layout';
import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { map } from 'rxjs';

import type { TocEntry } from '../../../shared/api/lessons';

/** Wide enough for the contents beside a 70ch column (see lesson-page.scss). */
export const tocBesideQuery = '(min-width: 1080px)';

/**
 * A lesson's headings as links: beside the text on a wide screen (sticky), folded at the top on a
 * narrow one. Links carry the lesson's own path and a fragment (a bare "#id" would resolve
 * against <base href="/">); the router scrolls to the heading. The heading being read is marked.
 */
@Component({
  selector: 'fl-table-of-contents',
  imports: [NgTemplateOutlet, RouterLink],
  template: `
    <nav class="toc" aria-label="On this page">
      @if (beside()) {
        <p class="toc-title" aria-hidden="true">On this page</p>
        <ng-container *ngTemplateOutlet="links" />
      } @else {
        <details class="folded">
          <summary class="toc-title">On this page</summary>
          <ng-container *ngTemplateOutlet="links" />
        </details>
      }
    </nav>
    <ng-template #links>
      <ol class="entries">
        @for (entry of entries(); track entry.id) {
          <li [class.sub]="entry.level === 3">
            <a
              [routerLink]="['/course', slug()]"
              [fragment]="entry.id"
              [attr.aria-current]="entry.id === current() ? 'location' : null"
            >{{ entry.text }}</a>
          </li>
        }
      </ol>
    </ng-template>
  `,
  styleUrl: './table-of-contents.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TableOfContents {
  readonly slug = input.required<string>();
  readonly entries = input.required<readonly TocEntry[]>();
  /** The id of the heading the reader is at. */
  readonly current = input<string>();

  private readonly breakpoints = inject(BreakpointObserver);
  protected readonly beside = toSignal(this.breakpoints.observe(tocBesideQuery).pipe(map((state) => state.matches)), {
    initialValue: this.breakpoints.isMatched(tocBesideQuery),
  });
}
