import type { Routes } from '@angular/router';

import { signedInGuard } from '../core/auth-guards';

// These paths are a contract: the server's e-mails link to /account/verify, /account/reset-password,
// /account/sign-in and /account/forgot-password (server/auth/auth.service.ts).
export const accountRoutes: Routes = [
  { path: '', pathMatch: 'full', redirectTo: 'profile' },
  { path: 'sign-in', title: 'Sign in', loadComponent: () => import('./sign-in-page').then((m) => m.SignInPage) },
  { path: 'sign-up', title: 'Create an account', loadComponent: () => import('./sign-up-page').then((m) => m.SignUpPage) },
  { path: 'verify', title: 'Confirm your e-mail address', loadComponent: () => import('./verify-page').then((m) => m.VerifyPage) },
  { path: 'forgot-password', title: 'Forgotten password', loadComponent: () => import('./forgot-password-page').then((m) => m.ForgotPasswordPage) },
  { path: 'reset-password', title: 'Choose a new password', loadComponent: () => import('./reset-password-page').then((m) => m.ResetPasswordPage) },
  { path: 'profile', title: 'Your profile', canActivate: [signedInGuard], loadComponent: () => import('./profile-page').then((m) => m.ProfilePage) },
  { path: 'not-allowed', title: 'Not allowed', loadComponent: () => import('./not-allowed-page').then((m) => m.NotAllowedPage) },
];
