import { HttpClient, httpResource, type HttpResourceRef } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { firstValueFrom } from 'rxjs';

import type { Account, DemoAccount, SignUpRequest } from '../../../shared/api/accounts';
import { problemDisplay } from '../core/problem';

/** The account pages' requests (`/api/auth/*`, `/api/account/*`); sign-in and sign-out live in AuthService. */
@Injectable({ providedIn: 'root' })
export class AccountApi {
  private readonly http = inject(HttpClient);

  /** The demo sign-ins; the server answers only in demo mode (404 otherwise, shown as nothing). */
  demoAccounts(): HttpResourceRef<DemoAccount[] | undefined> {
    return httpResource(() => '/api/auth/demo-accounts', { parse: parseDemoAccounts });
  }

  /** Answers 202 whether or not the address was new, with the message to show. */
  async signUp(request: SignUpRequest): Promise<string> {
    const body = await firstValueFrom(this.http.post<{ message: string }>('/api/auth/sign-up', request, { context: problemDisplay('form') }));
    return body.message;
  }

  /** The verify page shows the outcome itself. */
  async verify(token: string): Promise<void> {
    await firstValueFrom(this.http.post<void>('/api/auth/verify', { token }, { context: problemDisplay('page') }));
  }

  async forgotPassword(email: string): Promise<void> {
    await firstValueFrom(this.http.post<unknown>('/api/auth/forgot-password', { email }, { context: problemDisplay('form') }));
  }

  /** The reset page shows a used-up link beside its form. */
  async resetPassword(token: string, password: string): Promise<void> {
    await firstValueFrom(this.http.post<void>('/api/auth/reset-password', { token, password }, { context: problemDisplay('page') }));
  }

  /** Ends the account's other sessions; this one stays. */
  async changePassword(currentPassword: string, newPassword: string): Promise<void> {
    await firstValueFrom(this.http.post<void>('/api/auth/change-password', { currentPassword, newPassword }, { context: problemDisplay('form') }));
  }

  async updateProfile(displayName: string): Promise<Account> {
    const body = await firstValueFrom(this.http.patch<{ user: Account }>('/api/account/profile', { displayName }, { context: problemDisplay('form') }));
    return body.user;
  }
}

function parseDemoAccounts(raw: unknown): DemoAccount[] {
  const ok = Array.isArray(raw) && raw.every((a: Partial<DemoAccount>) => typeof a?.email === 'string' && typeof a.password === 'string');
  if (!ok) throw new Error('The demo sign-ins came back in an unexpected shape.');
  return raw;
}
