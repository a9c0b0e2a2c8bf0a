import { watch } from 'node:fs';

import type { Logger } from 'pino';

import { loadLessonLibrary, type LessonLibrary } from './lesson-library';

/**
 * Holds the rendered course: rendered on first use (main.ts asks at start-up, so the first
 * reader never waits), re-rendered in development when a lesson file changes.
 */
export class LessonStore {
  private library: LessonLibrary | undefined;

  constructor(private readonly dir: string, private readonly logger?: Logger) {}

  readonly current = (): LessonLibrary => (this.library ??= this.load());

  /** Re-render on change (development only: production renders once at start-up). */
  watch(): () => void {
    let timer: NodeJS.Timeout | undefined;
    const watcher = watch(this.dir, () => {
      clearTimeout(timer);
      timer = setTimeout(() => {
        this.library = this.load();
        this.logger?.info({ lessons: this.library.lessons.length }, 'lessons re-rendered');
      }, 150);
    });
    return () => watcher.close();
  }

  private load(): LessonLibrary {
    const library = loadLessonLibrary(this.dir);
    for (const error of library.errors) this.logger?.error({ error }, 'a lesson failed to render and is not served');
    return library;
  }
}
