import { DOCUMENT, DestroyRef, Directive, ElementRef, afterRenderEffect, inject, input } from '@angular/core';
import katex from 'katex';

import { KatexStylesheet } from './katex-stylesheet';

/**
 * Typesets engine-generated LaTeX into its host element. KaTeX writes the element's content itself
 * (HTML for the eye, MathML for assistive technology), in an effect: nothing passes through
 * Angular's sanitizer, which would strip KaTeX's inline styles, and no user text is ever rendered
 * here. A formula wider than its column scrolls sideways; it then takes keyboard focus so it can
 * be scrolled without a mouse.
 */
@Directive({
  selector: '[flKatex]',
  host: { class: 'katex-host' },
})
export class KatexRender {
  readonly flKatex = input.required<string>();

  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef).nativeElement;

  constructor() {
    inject(KatexStylesheet).load();
    // Every formula on the page is written first, then all are measured: one layout for the lot,
    // not one forced per formula.
    afterRenderEffect({
      write: () => {
        // \displaystyle: full-size fractions, while inline mode may still break a long line at = or +.
        katex.render(`\\displaystyle ${this.flKatex()}`, this.host, { throwOnError: false, output: 'htmlAndMathml' });
      },
      read: () => this.updateFocusability(),
    });
    if (typeof ResizeObserver !== 'undefined') {
      const observer = new ResizeObserver(() => this.updateFocusability());
      observer.observe(this.host);
      inject(DestroyRef).onDestroy(() => observer.disconnect());
    }
    // KaTeX's fonts arrive after the first layout and widen the formula.
    void inject(DOCUMENT).fonts?.ready.then(() => this.updateFocusability());
  }

  private updateFocusability(): void {
    if (this.host.scrollWidth > this.host.clientWidth + 1) this.host.setAttribute('tabindex', '0');
    else this.host.removeAttribute('tabindex');
  }
}
