import { Routes } from '@angular/router';

import { calculatorTitle } from './calculators/calculator-title';
import { roleGuard, signedInGuard } from './core/auth-guards';
import { lessonTitle, quizTitle } from './course/lesson-title';
import { HomePage } from './home/home-page';

// Every page but the home page is its own lazy chunk; the shell (top bar, navigation, footer) and
// the home page are all that load up front.
export const routes: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'Engine-air physics for the workshop',
    // The one page in the first download: most visits start here, and a lazy chunk would cost the
    // first paint another round trip.
    component: HomePage,
  },
  {
    path: 'course',
    title: 'Course',
    loadComponent: () => import('./course/course-outline').then((m) => m.CourseOutline),
  },
  {
    path: 'course/:slug/quiz',
    title: quizTitle,
    data: { needsConnection: true },
    canActivate: [signedInGuard],
    loadComponent: () => import('./quizzes/quiz-page').then((m) => m.QuizPage),
  },
  {
    path: 'course/:slug',
    title: lessonTitle,
    loadComponent: () => import('./course/lesson-page').then((m) => m.LessonPage),
  },
  {
    path: 'glossary',
    title: 'Glossary',
    loadComponent: () => import('./course/glossary-page').then((m) => m.GlossaryPage),
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
  { path: 'sign-in', pathMatch: 'full', redirectTo: '/account/sign-in' },
  // `needsConnection`: these pages work only with the server; offline, the shell says so instead.
  {
    path: 'account',
    data: { needsConnection: true },
    loadChildren: () => import('./account/account.routes').then((m) => m.accountRoutes),
  },
  {
    path: 'admin',
    data: { needsConnection: true },
    canActivate: [roleGuard('admin')],
    loadChildren: () => import('./admin/admin.routes').then((m) => m.adminRoutes),
  },
  {
    path: 'cohorts',
    data: { needsConnection: true },
    canActivate: [roleGuard('instructor')],
    loadChildren: () => import('./cohorts/cohorts.routes').then((m) => m.cohortsRoutes),
  },
  {
    path: 'grading',
    data: { needsConnection: true },
    canActivate: [roleGuard('instructor', 'admin')],
    loadChildren: () => import('./grading/grading.routes').then((m) => m.gradingRoutes),
  },
  {
    path: 'progress',
    title: 'My progress',
    data: { needsConnection: true },
    canActivate: [roleGuard('apprentice')],
    loadComponent: () => import('./progress/progress-page').then((m) => m.ProgressPage),
  },
  {
    path: 'invitations/accept',
    title: 'Your invitation',
    data: { needsConnection: true },
    loadComponent: () => import('./invitations/accept-invitation-page').then((m) => m.AcceptInvitationPage),
  },
  {
    path: 'notifications',
    title: 'Notifications',
    data: { needsConnection: true },
    canActivate: [signedInGuard],
    loadComponent: () => import('./notifications/notifications-page').then((m) => m.NotificationsPage),
  },
  {
    path: 'shop/orders/:id',
    title: 'Receipt',
    data: { needsConnection: true },
    canActivate: [roleGuard('shop_owner')],
    loadComponent: () => import('./shop/receipt-page').then((m) => m.ReceiptPage),
  },
  {
    path: 'shop',
    title: 'My shop',
    data: { needsConnection: true },
    canActivate: [roleGuard('shop_owner')],
    loadComponent: () => import('./shop/shop-page').then((m) => m.ShopPage),
  },
  {
    path: '**',
    title: 'Page not found',
    loadComponent: () => import('./shell/not-found-page').then((m) => m.NotFoundPage),
  },
];
