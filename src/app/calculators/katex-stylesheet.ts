import { DOCUMENT, Injectable, inject } from '@angular/core';

/**
 * KaTeX's stylesheet (and, through it, its fonts) is built as the lazy global bundle "katex"
 * (angular.json: styles, inject: false): katex.css beside index.html, fonts under media/. It is
 * linked the first time a formula is shown, so pages without maths never load it.
 */
@Injectable({ providedIn: 'root' })
export class KatexStylesheet {
  private readonly document = inject(DOCUMENT);
  private linked = false;

  load(): void {
    if (this.linked) return;
    this.linked = true;
    const link = this.document.createElement('link');
    link.rel = 'stylesheet';
    link.href = 'katex.css';
    this.document.head.appendChild(link);
  }
}
