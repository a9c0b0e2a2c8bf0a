import { Routes } from '@angular/router';

import { calculatorTitle } from './calculators/calculator-title';

// Every page is its own lazy chunk; the shell (top bar, navigation, footer) is all that loads up front.
export const routes: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'Engine-air physics for the workshop',
    loadComponent: () => import('./home/home-page').then((m) => m.HomePage),
  },
  {
    path: 'course',
    title: 'Course',
    loadComponent: () => import('./course/course-outline').then((m) => m.CourseOutline),
  },
  {
    path: 'calculators',
    title: 'Calculators',
    loadComponent: () =>
      import('./calculators/calculator-index').then((m) => m.CalculatorIndex),
  },
  {
    path: 'calculators/:id',
    title: calculatorTitle,
    loadComponent: () => import('./calculators/calculator-page').then((m) => m.CalculatorPage),
  },
  {
    path: 'sign-in',
    title: 'Sign in',
    loadComponent: () => import('./account/sign-in-page').then((m) => m.SignInPage),
  },
  {
    path: '**',
    title: 'Page not found',
    loadComponent: () => import('./shell/not-found-page').then((m) => m.NotFoundPage),
  },
];
