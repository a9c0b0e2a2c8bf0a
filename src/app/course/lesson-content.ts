import {
  ApplicationRef,
  ChangeDetectionStrategy,
  Component,
  type ComponentRef,
  DOCUMENT,
  DestroyRef,
  ElementRef,
  EnvironmentInjector,
  Injector,
  type Type,
  ViewEncapsulation,
  afterRenderEffect,
  createComponent,
  inject,
  input,
  output,
  untracked,
} from '@angular/core';
import { Router } from '@angular/router';

import type { LessonPage } from '../../../shared/api/lessons';
import { AppUpdates, isMissingChunk } from '../core/app-updates';

/**
 * The live parts load with their own code (the engine, forms, KaTeX) when the reader comes within
 * a screen or so of them, or once the page has been up 6 s (so find-in-page and a printout have
 * them), whichever is first: the text is readable and scrollable at once, even on a slow tablet,
 * and a lesson with six calculators does not build all six before it.
 */
const NEAR_VIEWPORT = '800px 0px';
const LOAD_ANYWAY_MS = 6000;
const loadCalculator = () => import('./lesson-calculator').then((m) => m.LessonCalculator);
const loadTry = () => import('./lesson-try').then((m) => m.LessonTry);

/**
 * A lesson's text: the server's HTML, with live Angular components mounted at its placeholders —
 * a calculator panel at each `[data-embed]`, a "check these numbers" link at each `[data-try]`.
 * The components are attached to the application (not to a view container: they live inside
 * HTML Angular did not write) and destroyed with the lesson they belong to.
 */
@Component({
  selector: 'fl-lesson-content',
  template: '',
  styleUrl: './lesson-content.scss',
  // The HTML arrives as a string, so its elements carry no view-scoped attributes: the styles are
  // global, every selector under .lesson-text.
  encapsulation: ViewEncapsulation.None,
  host: { class: 'lesson-text', '(click)': 'followInternalLink($event)' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LessonContent {
  readonly lesson = input.required<LessonPage>();
  /** After each lesson is in place: its h2/h3 headings, in order, for the reading position. */
  readonly rendered = output<readonly HTMLElement[]>();

  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef).nativeElement;
  private readonly appRef = inject(ApplicationRef);
  private readonly environmentInjector = inject(EnvironmentInjector);
  private readonly elementInjector = inject(Injector);
  private readonly router = inject(Router);
  private readonly updates = inject(AppUpdates);
  private readonly window = inject(DOCUMENT).defaultView;
  private mounted: ComponentRef<unknown>[] = [];
  /** Placeholders still waiting for their component, and what to mount there. */
  private waiting = new Map<HTMLElement, () => Promise<void>>();
  private readonly near =
    typeof IntersectionObserver === 'undefined'
      ? undefined
      : new IntersectionObserver((entries) => {
          for (const entry of entries) if (entry.isIntersecting) this.mountNow(entry.target as HTMLElement);
        }, { rootMargin: NEAR_VIEWPORT });
  private loadAnyway?: ReturnType<typeof setTimeout>;
  /** Check-yourself answers opened for printing, to close again afterwards. */
  private openedForPrint: HTMLDetailsElement[] = [];

  constructor() {
    afterRenderEffect({
      write: () => {
        const lesson = this.lesson();
        untracked(() => this.show(lesson));
      },
    });
    const beforePrint = () => this.openAnswersForPrint();
    const afterPrint = () => this.closeAnswersAfterPrint();
    this.window?.addEventListener('beforeprint', beforePrint);
    this.window?.addEventListener('afterprint', afterPrint);
    // The column, KaTeX's stylesheet and its fonts all change how wide a formula is.
    const resizes = typeof ResizeObserver === 'undefined' ? undefined : new ResizeObserver(() => this.updateMathFocus());
    resizes?.observe(this.host);
    void inject(DOCUMENT).fonts?.ready.then(() => this.updateMathFocus());
    inject(DestroyRef).onDestroy(() => {
      resizes?.disconnect();
      this.near?.disconnect();
      clearTimeout(this.loadAnyway);
      this.unmount();
      this.window?.removeEventListener('beforeprint', beforePrint);
      this.window?.removeEventListener('afterprint', afterPrint);
    });
  }

  private show(lesson: LessonPage): void {
    this.unmount();
    // Safe without Angular's sanitizer: the server rendered this HTML from our own Markdown and ran
    // DOMPurify over it (server/lessons/sanitize.ts: no scripts, handlers, forms or javascript:
    // URLs). Angular's sanitizer would strip the inline styles KaTeX positions formulas with.
    this.host.innerHTML = lesson.html;

    for (const placeholder of Array.from(this.host.querySelectorAll<HTMLElement>('[data-embed]'))) {
      const embed = lesson.embeds.find((e) => String(e.index) === placeholder.dataset['embed']);
      if (embed !== undefined) this.mountLater(placeholder, async () => this.mount(await loadCalculator(), placeholder, { embed }));
    }
    for (const placeholder of Array.from(this.host.querySelectorAll<HTMLElement>('[data-try]'))) {
      const check = lesson.results.find((r) => String(r.index) === placeholder.dataset['try']);
      if (check !== undefined) this.mountLater(placeholder, async () => this.mount(await loadTry(), placeholder, { check }));
    }
    this.loadAnyway = setTimeout(() => {
      for (const placeholder of Array.from(this.waiting.keys())) this.mountNow(placeholder);
    }, LOAD_ANYWAY_MS);
    this.updateMathFocus();
    this.rendered.emit(Array.from(this.host.querySelectorAll<HTMLElement>('h2[id], h3[id]')));
  }

  /** A formula wider than the column scrolls sideways, and then takes keyboard focus so it can be scrolled without a mouse. */
  private updateMathFocus(): void {
    for (const math of Array.from(this.host.querySelectorAll<HTMLElement>('.katex-display'))) {
      if (math.scrollWidth > math.clientWidth + 1) math.tabIndex = 0;
      else math.removeAttribute('tabindex');
    }
  }

  private mountLater(placeholder: HTMLElement, mount: () => Promise<void>): void {
    this.waiting.set(placeholder, mount);
    if (this.near) this.near.observe(placeholder);
    else this.mountNow(placeholder);
  }

  private mountNow(placeholder: HTMLElement): void {
    const mount = this.waiting.get(placeholder);
    if (!mount) return;
    this.waiting.delete(placeholder);
    this.near?.unobserve(placeholder);
    const lesson = this.lesson();
    mount().then(
      () => {
        // The lesson changed while the code was on its way: that placeholder is gone.
        if (this.lesson() !== lesson) return;
        this.updateMathFocus();
      },
      (error: unknown) => {
        // Its code is gone from the server (a new version): offer the reload. Not fetched (offline
        // with no copy yet): try again when the browser is back online.
        if (isMissingChunk(error) && this.window?.navigator.onLine) this.updates.chunkMissing();
        this.window?.addEventListener('online', () => this.lesson() === lesson && this.mountLater(placeholder, mount), { once: true });
      },
    );
  }

  private mount<T>(type: Type<T>, hostElement: HTMLElement, inputs: Readonly<Record<string, unknown>>): void {
    if (!hostElement.isConnected) return;
    const ref = createComponent(type, {
      environmentInjector: this.environmentInjector,
      elementInjector: this.elementInjector,
      hostElement,
    });
    for (const [name, value] of Object.entries(inputs)) ref.setInput(name, value);
    // Checked with the application's views from now on, as if it were in a template.
    this.appRef.attachView(ref.hostView);
    ref.changeDetectorRef.markForCheck();
    this.mounted.push(ref);
  }

  /** Destroying a view also detaches it from the application. */
  private unmount(): void {
    for (const ref of this.mounted) ref.destroy();
    this.mounted = [];
    this.near?.disconnect();
    this.waiting.clear();
    clearTimeout(this.loadAnyway);
  }

  /** Links to the course, calculators and glossary stay inside the app (no full page load). */
  protected followInternalLink(event: MouseEvent): void {
    if (event.defaultPrevented || event.button !== 0 || event.ctrlKey || event.metaKey || event.shiftKey || event.altKey) return;
    const link = (event.target as Element | null)?.closest?.('a[href]');
    if (!(link instanceof HTMLAnchorElement) || !this.host.contains(link) || link.target) return;
    // Mounted components' own router links handle themselves.
    if (this.mounted.some((ref) => (ref.location.nativeElement as HTMLElement).contains(link))) return;
    const href = link.getAttribute('href') ?? '';
    if (!href.startsWith('/') || href.startsWith('//')) return;
    event.preventDefault();
    void this.router.navigateByUrl(href);
  }

  private openAnswersForPrint(): void {
    this.openedForPrint = Array.from(this.host.querySelectorAll<HTMLDetailsElement>('details.lesson-check:not([open])'));
    for (const details of this.openedForPrint) details.open = true;
  }

  private closeAnswersAfterPrint(): void {
    for (const details of this.openedForPrint) details.open = false;
    this.openedForPrint = [];
  }
}
