import type { Routes } from '@angular/router';

/** `/cohorts`: an instructor's cohorts (the route guard admits instructors only). */
export const cohortsRoutes: Routes = [
  { path: '', title: 'Your cohorts', loadComponent: () => import('./cohort-list-page').then((m) => m.CohortListPage) },
  { path: ':id', title: 'Cohort', loadComponent: () => import('./cohort-page').then((m) => m.CohortPage) },
];
