import type { Logger } from 'pino';

import { loadQuizLibrary, type QuizLibrary } from './quiz-library';

/**
 * The quizzes, loaded and rendered on first use (after the lessons, whose slugs they must match).
 * A quiz that fails to load is logged and not served; the content tests fail on it.
 */
export function quizStore(dir: string, lessonSlugs: () => readonly string[], logger?: Logger): () => QuizLibrary {
  let library: QuizLibrary | undefined;
  return () => {
    if (!library) {
      library = loadQuizLibrary(dir, lessonSlugs());
      for (const error of library.errors) logger?.error({ error }, 'a quiz failed to load and is not served');
    }
    return library;
  };
}
