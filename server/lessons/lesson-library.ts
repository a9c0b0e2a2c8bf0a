import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';

import { describeCalculator } from '../../shared/airflow';
import type { GlossaryEntry, LessonOutline, LessonPage } from '../../shared/api/lessons';
import { cacheJson, type CachedBody } from '../http/cached-body';
import { linksIn } from './sanitize';
import { renderLesson, type RenderedLesson } from './render-lesson';

export interface LessonLibrary {
  readonly lessons: readonly RenderedLesson[];
  readonly outline: CachedBody;
  readonly glossary: CachedBody;
  readonly pages: ReadonlyMap<string, CachedBody>;
  /** Files that failed to render (the content tests require this to be empty). */
  readonly errors: readonly string[];
}

function outlineOf(lesson: RenderedLesson): LessonOutline {
  const { slug, title, order, summary, minutes, objectives, labObjectives, free } = lesson.meta;
  return { slug, title, order, summary, minutes, objectives, labObjectives, free };
}

/**
 * Renders every lesson in `dir` once; the API serves the cached bodies. Figures come from the
 * `figures` folder beside it (`content/figures/<stem>.svg`).
 */
export function loadLessonLibrary(dir: string): LessonLibrary {
  const figures = join(dirname(dir), 'figures');
  const figure = (stem: string) => {
    const file = join(figures, `${stem}.svg`);
    return /^[a-z0-9-]+$/.test(stem) && existsSync(file) ? readFileSync(file, 'utf8') : undefined;
  };
  const lessons: RenderedLesson[] = [];
  const errors: string[] = [];
  const files = existsSync(dir) ? readdirSync(dir).filter((f) => f.endsWith('.md')).sort() : [];
  if (files.length === 0) errors.push(`no lesson files (*.md) in ${dir}`);
  for (const file of files) {
    try {
      lessons.push(renderLesson(readFileSync(join(dir, file), 'utf8'), file, { figure }));
    } catch (error) {
      errors.push(error instanceof Error ? error.message : String(error));
    }
  }
  lessons.sort((a, b) => a.meta.order - b.meta.order);
  const pages = new Map<string, CachedBody>();
  lessons.forEach((lesson, i) => {
    const link = (other: RenderedLesson | undefined) => (other ? { slug: other.meta.slug, title: other.meta.title } : null);
    const page: LessonPage = {
      ...outlineOf(lesson),
      html: lesson.html,
      toc: lesson.toc,
      embeds: lesson.embeds,
      results: lesson.results,
      previous: link(lessons[i - 1]),
      next: link(lessons[i + 1]),
    };
    pages.set(lesson.meta.slug, cacheJson(page));
  });
  const glossary: GlossaryEntry[] = lessons
    .flatMap((lesson) => lesson.meta.glossary.map((entry) => ({ ...entry, lesson: { slug: lesson.meta.slug, title: lesson.meta.title } })))
    .sort((a, b) => a.term.localeCompare(b.term, 'en'));
  return { lessons, outline: cacheJson(lessons.map(outlineOf)), glossary: cacheJson(glossary), pages, errors };
}

const SITE_PAGES = new Set(['/', '/course', '/calculators', '/glossary']);

/** Every link inside the course that would lead nowhere, as "slug: href" lines. */
export function brokenLinks(library: LessonLibrary): string[] {
  const anchors = new Map(library.lessons.map((l) => [l.meta.slug, new Set(l.anchors)]));
  const broken: string[] = [];
  for (const lesson of library.lessons) {
    for (const href of linksIn(lesson.html)) {
      if (/^https?:\/\//.test(href) || href.startsWith('mailto:')) continue;
      const [path = '', anchor] = href.split('#');
      const course = /^\/course\/([a-z0-9-]+)$/.exec(path);
      const calculator = /^\/calculators\/([a-z0-9-]+)$/.exec(path);
      const ok =
        (path === '' && anchor !== undefined && anchors.get(lesson.meta.slug)!.has(anchor)) ||
        (SITE_PAGES.has(path) && anchor === undefined) ||
        (course !== null && anchors.has(course[1]!) && (anchor === undefined || anchors.get(course[1]!)!.has(anchor))) ||
        (calculator !== null && anchor === undefined && describeCalculator(calculator[1]!) !== undefined);
      if (!ok) broken.push(`${lesson.meta.slug}: ${href}`);
    }
  }
  return broken;
}
