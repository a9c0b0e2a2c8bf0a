import { ChangeDetectionStrategy, Component, ElementRef, ViewEncapsulation, afterRenderEffect, inject, input } from '@angular/core';

import { KatexStylesheet } from '../calculators/katex-stylesheet';

/**
 * A stem, choice or explanation as the API sends it: HTML the server rendered from our own quiz
 * Markdown (KaTeX included) and ran DOMPurify over, inserted as the lesson page inserts lesson HTML
 * (`course/lesson-content.ts`). Angular's sanitizer would strip the inline styles KaTeX positions
 * formulas with. Never give it text a user typed: written answers are shown as text.
 */
@Component({
  selector: 'fl-quiz-html',
  template: '',
  styles: `
    .quiz-html {
      display: block;
      overflow-wrap: break-word;

      > :first-child {
        margin-top: 0;
      }

      > :last-child {
        margin-bottom: 0;
      }

      .katex-display {
        overflow-x: auto;
        overflow-y: hidden;
      }
    }
  `,
  // The HTML arrives as a string, so its elements carry no view-scoped attributes.
  encapsulation: ViewEncapsulation.None,
  host: { class: 'quiz-html' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class QuizHtml {
  readonly html = input.required<string>();

  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef).nativeElement;

  constructor() {
    inject(KatexStylesheet).load();
    afterRenderEffect({
      write: () => {
        this.host.innerHTML = this.html();
      },
    });
  }
}
