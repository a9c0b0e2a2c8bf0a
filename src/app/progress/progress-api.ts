import { HttpClient, httpResource, type HttpResourceRef } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { firstValueFrom } from 'rxjs';

import type { LessonEvent, MyProgress } from '../../../shared/api/progress';
import { problemDisplay } from '../core/problem';

/** The signed-in apprentice's own progress (`/api/progress`). */
@Injectable({ providedIn: 'root' })
export class ProgressApi {
  private readonly http = inject(HttpClient);

  /**
   * Lessons opened and finished, quizzes and last activity. No request while `enabled` is false (not
   * an apprentice). `background`: a page that is public anyway (the course outline) stays put when
   * the session has ended, instead of going to the sign-in page.
   */
  mine(enabled: () => boolean = () => true, display: 'page' | 'background' = 'page'): HttpResourceRef<MyProgress | undefined> {
    return httpResource(() => (enabled() ? { url: '/api/progress', context: problemDisplay(display) } : undefined), { parse: parseProgress });
  }

  /** "Opened" or "finished": quiet, the reader never asked for it; a failure (offline) is dropped. */
  async recordLesson(slug: string, event: LessonEvent['event']): Promise<void> {
    try {
      await firstValueFrom(this.http.post(`/api/progress/lessons/${encodeURIComponent(slug)}`, { event }, { context: problemDisplay('background') }));
    } catch {
      // Progress is a record, not the lesson: reading goes on.
    }
  }
}

function parseProgress(raw: unknown): MyProgress {
  const progress = raw as Partial<MyProgress> | null;
  if (!Array.isArray(progress?.lessons) || !Array.isArray(progress.quizzes)) throw new Error('Your progress came back in an unexpected shape.');
  return progress as MyProgress;
}
