import { ViewportScroller } from '@angular/common';
import { HttpErrorResponse } from '@angular/common/http';
import {
  ChangeDetectionStrategy,
  Component,
  DOCUMENT,
  DestroyRef,
  ElementRef,
  afterNextRender,
  computed,
  effect,
  inject,
  input,
  linkedSignal,
  signal,
  untracked,
  viewChild,
} from '@angular/core';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { ActivatedRoute, RouterLink } from '@angular/router';

import { KatexStylesheet } from '../calculators/katex-stylesheet';
import { AuthService } from '../core/auth.service';
import { ProgressApi } from '../progress/progress-api';
import { LessonContent } from './lesson-content';
import { LessonsService } from './lessons.service';
import { ReadingPositionService } from './reading-position.service';
import { TableOfContents } from './table-of-contents';

/** A heading counts as reached once it is in the top quarter of the window. */
const reachedLine = 0.25;
/** The reader has reached the end once the window is this far through the text. */
const finishedAt = 0.98;

/**
 * One lesson: title, time and objectives, its contents, the text with live calculators, previous
 * and next. Remembers the last heading reached and offers to go back there on the next visit.
 */
@Component({
  selector: 'fl-lesson-page',
  imports: [LessonContent, MatButton, MatIcon, MatIconButton, RouterLink, TableOfContents],
  templateUrl: './lesson-page.html',
  styleUrl: './lesson-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LessonPage {
  /** The lesson's slug, from the route. */
  readonly slug = input.required<string>();

  private readonly positions = inject(ReadingPositionService);
  private readonly route = inject(ActivatedRoute);
  private readonly document = inject(DOCUMENT);
  private readonly scroller = inject(ViewportScroller);
  private readonly progressApi = inject(ProgressApi);
  protected readonly auth = inject(AuthService);

  protected readonly lesson = inject(LessonsService).lesson(this.slug);
  protected readonly page = computed(() => (this.lesson.hasValue() ? this.lesson.value() : undefined));
  protected readonly notFound = computed(() => {
    const error = this.lesson.error();
    return error instanceof HttpErrorResponse && error.status === 404;
  });

  /** The heading the reader is at, for the contents. */
  protected readonly current = signal<string | undefined>(undefined);
  /** How far through the text the window is, 0…1. */
  protected readonly progress = signal(0);

  /** "Continue where you left off": the heading reached on an earlier visit, until used or dismissed. */
  protected readonly resume = linkedSignal(() => {
    const page = this.page();
    if (page === undefined) return undefined;
    return untracked(() => {
      if (this.route.snapshot.fragment) return undefined;
      const id = this.positions.recall(page.slug);
      return page.toc.find((entry) => entry.id === id);
    });
  });

  private readonly article = viewChild<ElementRef<HTMLElement>>('article');
  private headingWatch?: IntersectionObserver;

  constructor() {
    // An apprentice's progress: "opened" once per lesson shown, "finished" once the end is reached.
    const reported = new Set<string>();
    const report = (slug: string, event: 'opened' | 'finished') => {
      if (reported.has(`${event}:${slug}`)) return;
      reported.add(`${event}:${slug}`);
      void this.progressApi.recordLesson(slug, event);
    };
    effect(() => {
      const slug = this.page()?.slug;
      if (slug === undefined || this.auth.role() !== 'apprentice') return;
      untracked(() => report(slug, 'opened'));
      if (this.progress() >= finishedAt) untracked(() => report(slug, 'finished'));
    });

    // Lessons are full of formulas: KaTeX's stylesheet and fonts come with this page, not the home page.
    inject(KatexStylesheet).load();

    const window = this.document.defaultView;
    const measure = () => this.measureProgress();
    afterNextRender(() => {
      window?.addEventListener('scroll', measure, { passive: true });
      window?.addEventListener('resize', measure, { passive: true });
    });
    inject(DestroyRef).onDestroy(() => {
      window?.removeEventListener('scroll', measure);
      window?.removeEventListener('resize', measure);
      this.headingWatch?.disconnect();
    });
  }

  /** The text is in place: watch its headings, and go to the heading the address names, if any. */
  protected contentRendered(headings: readonly HTMLElement[]): void {
    const slug = this.page()?.slug;
    this.headingWatch?.disconnect();
    this.current.set(undefined);
    if (slug === undefined || typeof IntersectionObserver === 'undefined') return;
    const window = this.document.defaultView;
    this.headingWatch = new IntersectionObserver(
      () => {
        const line = (window?.innerHeight ?? 0) * reachedLine;
        let reached: HTMLElement | undefined;
        for (const heading of headings) {
          if (heading.getBoundingClientRect().top > line) break;
          reached = heading;
        }
        if (reached === undefined || reached.id === this.current()) return;
        this.current.set(reached.id);
        this.positions.remember(slug, reached.id);
      },
      // The root reaches far above the window, so a heading changes state exactly when it crosses
      // the line, however far a jump (a contents link, "continue") carries it past.
      { rootMargin: `99999px 0px -${100 - reachedLine * 100}% 0px` },
    );
    for (const heading of headings) this.headingWatch.observe(heading);

    // The router tried to scroll to the fragment before the text had arrived.
    const fragment = this.route.snapshot.fragment;
    if (fragment) this.scroller.scrollToAnchor(fragment);
    this.measureProgress();
  }

  protected retry(): void {
    this.lesson.reload();
  }

  private measureProgress(): void {
    const article = this.article()?.nativeElement;
    const window = this.document.defaultView;
    if (article === undefined || window === null) return;
    const box = article.getBoundingClientRect();
    const travel = box.height - window.innerHeight;
    const progress = travel <= 0 ? 1 : Math.min(1, Math.max(0, -box.top / travel));
    if (Math.abs(progress - this.progress()) >= 0.002) this.progress.set(progress);
  }
}
