import { HttpClient, httpResource, type HttpResourceRef } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { firstValueFrom } from 'rxjs';

import type { GlossaryEntry, LessonOutline, LessonPage } from '../../../shared/api/lessons';

/** The course's reads: the outline, a lesson page, the glossary (GET /api/lessons…, /api/glossary). */
@Injectable({ providedIn: 'root' })
export class LessonsService {
  private readonly http = inject(HttpClient);
  private outlineOnce?: Promise<LessonOutline[]>;

  /** The lessons in course order. Call in an injection context (a component's field). */
  outline(): HttpResourceRef<LessonOutline[] | undefined> {
    return httpResource(() => '/api/lessons', { parse: parseOutline });
  }

  /** One lesson page; follows the slug as it changes. */
  lesson(slug: () => string): HttpResourceRef<LessonPage | undefined> {
    return httpResource(() => `/api/lessons/${encodeURIComponent(slug())}`, { parse: parseLessonPage });
  }

  glossary(): HttpResourceRef<GlossaryEntry[] | undefined> {
    return httpResource(() => '/api/glossary', { parse: parseGlossary });
  }

  /** Reads the outline and every free lesson, so the service worker keeps them for offline use. */
  async cacheFreeLessons(): Promise<void> {
    const outline = parseOutline(await firstValueFrom(this.http.get<unknown>('/api/lessons')));
    for (const lesson of outline.filter((l) => l.free)) {
      await firstValueFrom(this.http.get<unknown>(`/api/lessons/${encodeURIComponent(lesson.slug)}`));
    }
  }

  /**
   * A lesson's title for the page title, from the outline (fetched once per visit): null when the
   * course has no such lesson, undefined when the outline could not be read.
   */
  async titleOf(slug: string): Promise<string | null | undefined> {
    this.outlineOnce ??= firstValueFrom(this.http.get<unknown>('/api/lessons')).then(parseOutline);
    try {
      return (await this.outlineOnce).find((lesson) => lesson.slug === slug)?.title ?? null;
    } catch {
      this.outlineOnce = undefined;
      return undefined;
    }
  }
}

// The server builds these shapes from shared/api/lessons.ts; the checks catch a proxy's HTML error
// page or a half-deployed server, not every field.

function parseOutline(raw: unknown): LessonOutline[] {
  if (!Array.isArray(raw) || !raw.every(isOutline)) throw new Error('The course outline came back in an unexpected shape.');
  return raw;
}

function parseLessonPage(raw: unknown): LessonPage {
  const ok =
    isOutline(raw) &&
    typeof (raw as Partial<LessonPage>).html === 'string' &&
    Array.isArray((raw as Partial<LessonPage>).toc) &&
    Array.isArray((raw as Partial<LessonPage>).embeds) &&
    Array.isArray((raw as Partial<LessonPage>).results);
  if (!ok) throw new Error('The lesson came back in an unexpected shape.');
  return raw as LessonPage;
}

function parseGlossary(raw: unknown): GlossaryEntry[] {
  const ok =
    Array.isArray(raw) &&
    raw.every(
      (entry: Partial<GlossaryEntry>) =>
        typeof entry?.term === 'string' && typeof entry.definition === 'string' && typeof entry.lesson?.slug === 'string',
    );
  if (!ok) throw new Error('The glossary came back in an unexpected shape.');
  return raw;
}

function isOutline(raw: unknown): raw is LessonOutline {
  const lesson = raw as Partial<LessonOutline> | null;
  return (
    typeof lesson === 'object' &&
    lesson !== null &&
    typeof lesson.slug === 'string' &&
    typeof lesson.title === 'string' &&
    typeof lesson.order === 'number' &&
    Array.isArray(lesson.objectives)
  );
}
