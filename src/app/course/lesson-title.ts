import { inject } from '@angular/core';
import type { ResolveFn } from '@angular/router';

import { LessonsService } from './lessons.service';

/**
 * The page title of /course/:slug: the lesson's own title. A resolver rather than an effect: the
 * title strategy runs after every navigation, and the table of contents navigates (same lesson,
 * new fragment) on every click.
 */
export const lessonTitle: ResolveFn<string> = async (route) => {
  const lessons = inject(LessonsService);
  const title = await lessons.titleOf(route.paramMap.get('slug') ?? '');
  return title === null ? 'No such lesson' : (title ?? 'Lesson');
};

/** The page title of /course/:slug/quiz: "<lesson> quiz". */
export const quizTitle: ResolveFn<string> = async (route) => {
  const title = await inject(LessonsService).titleOf(route.paramMap.get('slug') ?? '');
  return title ? `${title}: quiz` : 'Quiz';
};
