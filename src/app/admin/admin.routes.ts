import type { Routes } from '@angular/router';

import { AdminPage } from './admin-page';

/** `/admin`: users and roles, the e-mail outbox, the audit log (the route guard admits admins only). */
export const adminRoutes: Routes = [
  {
    path: '',
    component: AdminPage,
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'users' },
      { path: 'users', title: 'Users · Admin', loadComponent: () => import('./users-page').then((m) => m.UsersPage) },
      { path: 'outbox', title: 'Sent e-mail · Admin', loadComponent: () => import('./outbox-page').then((m) => m.OutboxPage) },
      { path: 'audit', title: 'Audit log · Admin', loadComponent: () => import('./audit-page').then((m) => m.AuditPage) },
    ],
  },
];
