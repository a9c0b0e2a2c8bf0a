import type { Routes } from '@angular/router';

/** `/grading`: the instructor's queue of written answers and the attempts they grade (the route guard admits instructors and admins). */
export const gradingRoutes: Routes = [
  { path: '', title: 'Grading', loadComponent: () => import('./grading-queue-page').then((m) => m.GradingQueuePage) },
  { path: 'attempts/:id', title: 'Attempt', loadComponent: () => import('./grading-attempt-page').then((m) => m.GradingAttemptPage) },
];
