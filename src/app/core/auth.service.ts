import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';

import type { Account, MeResponse, PreferencesRequest, Role, SignInRequest } from '../../../shared/api/accounts';
import { problemDisplay } from './problem';

/**
 * Who is signed in, as signals for the shell, the guards and the pages. Loaded once at start-up
 * from `GET /api/auth/me`; the session itself is an HttpOnly cookie the app never reads.
 */
@Injectable({ providedIn: 'root' })
export class AuthService {
  private readonly http = inject(HttpClient);
  private readonly current = signal<Account | null>(null);
  private readonly answered = signal(false);
  private firstLoad?: Promise<void>;
  /** Counts changes of who is signed in, so an answer to an older question is dropped. */
  private changes = 0;

  readonly user = this.current.asReadonly();
  /** Whether the server has said who this is (false only while the first GET /api/auth/me is out). */
  readonly known = this.answered.asReadonly();
  readonly role = computed<Role | null>(() => this.current()?.role ?? null);
  readonly signedIn = computed(() => this.current() !== null);

  /**
   * Asks once at start-up, without holding up the first page: public pages render at once, and
   * the guards of the pages that depend on the answer wait for it (`whenKnown`).
   */
  start(): void {
    this.firstLoad ??= this.load();
  }

  /** Resolves once the start-up question has been answered. */
  whenKnown(): Promise<void> {
    this.start();
    return this.firstLoad as Promise<void>;
  }

  /** Asks the server who this is; a visitor (or an unreachable API, offline) counts as signed out. */
  async load(): Promise<void> {
    const asked = this.changes;
    let user: Account | null = null;
    try {
      const me = await firstValueFrom(this.http.get<MeResponse>('/api/auth/me'));
      user = me?.user ?? null;
    } catch {
      user = null;
    }
    // Signed in or out while the question was out: that newer state stands.
    if (asked === this.changes) this.set(user);
    this.answered.set(true);
  }

  /**
   * Signs in; the server starts a new session and sends a new XSRF-TOKEN cookie with it. The sign-in
   * page shows a refusal beside the form itself (it must outlast a snackbar).
   */
  async signIn(credentials: SignInRequest): Promise<Account> {
    const { user } = await firstValueFrom(
      this.http.post<{ user: Account }>('/api/auth/sign-in', credentials, { context: problemDisplay('page') }),
    );
    this.set(user);
    return user;
  }

  async signOut(): Promise<void> {
    try {
      await firstValueFrom(this.http.post<void>('/api/auth/sign-out', null));
    } finally {
      this.set(null);
    }
  }

  /**
   * Saves choices that follow the account to other devices (the calculators' units), in the
   * background: nothing is shown either way, and a lost session signs the app out without leaving
   * the page the reader is working on. The answer updates the account only if the same person is
   * still signed in.
   */
  async savePreferences(preferences: PreferencesRequest): Promise<void> {
    const { user } = await firstValueFrom(
      this.http.patch<{ user: Account }>('/api/account/preferences', preferences, { context: problemDisplay('background') }),
    );
    if (this.current()?.id === user.id) this.set(user);
  }

  /** After the server answered with a changed account (profile) or said the session is gone (401). */
  setUser(user: Account | null): void {
    this.set(user);
  }

  private set(user: Account | null): void {
    this.changes += 1;
    this.current.set(user);
    this.answered.set(true);
  }
}
