import { Injectable, effect, inject, linkedSignal } from '@angular/core';

import type { Account } from '../../../shared/api/accounts';
import { AuthService } from '../core/auth.service';
import { ConnectivityService } from '../core/connectivity.service';
import { UnitSystem, isUnitSystem } from './unit-system';
import { browserLanguages, unitSystemForLanguages } from './unit-system-by-region';

const storageKey = 'flowlore.units';

/**
 * The reader's unit system. A visitor's is this browser's: the last switch (localStorage), else a
 * guess from the browser's language region. A signed-in user's is saved with the account, so it
 * follows them to another device: the account's choice wins when the account arrives (start-up,
 * sign-in), and every switch while signed in is saved to it. An account with no choice yet gets one
 * at the first switch, never merely by loading a page. Signing out leaves the units as they are.
 */
@Injectable({ providedIn: 'root' })
export class UnitSystemService {
  private readonly auth = inject(AuthService);
  private readonly online = inject(ConnectivityService).online;
  /** A switch made offline, saved to the account when the connection is back. */
  private unsaved: { system: UnitSystem; userId: string } | null = null;
  private readonly local = readStored() ?? unitSystemForLanguages(browserLanguages());
  /** Saves one after another, so the account ends with the last switch even when clicks outrun the network. */
  private saving: Promise<void> = Promise.resolve();

  private readonly chosen = linkedSignal<Account | null, UnitSystem>({
    source: this.auth.user,
    computation: (user, previous) => {
      // Still the same person (a rename, a saved preference): keep what they switched to here.
      if (user !== null && previous?.source?.id === user.id) return previous.value;
      return user?.unitSystem ?? previous?.value ?? this.local;
    },
  });

  readonly preference = this.chosen.asReadonly();

  constructor() {
    // The account's choice becomes this browser's too (after sign-out the next visit opens the same
    // way), once it is what the page shows: an older answer to a queued save is not stored.
    effect(() => {
      const saved = this.auth.user()?.unitSystem;
      if (saved && saved === this.chosen()) store(saved);
    });
    effect(() => {
      if (this.online()) this.saveUnsaved();
    });
  }

  choose(system: UnitSystem): void {
    this.chosen.set(system);
    store(system);
    const userId = this.auth.user()?.id;
    if (userId === undefined) return;
    this.unsaved = { system, userId };
    if (this.online()) this.saveUnsaved();
  }

  /**
   * Fire and forget, in the background (nothing shown; the switch stands here whatever the answer).
   * A save still queued when its user has signed out is dropped, never sent for someone else.
   */
  private saveUnsaved(): void {
    const pending = this.unsaved;
    if (pending === null) return;
    this.unsaved = null;
    this.saving = this.saving
      .then(() => (this.auth.user()?.id === pending.userId ? this.auth.savePreferences({ unitSystem: pending.system }) : undefined))
      .catch(() => undefined);
  }
}

function readStored(): UnitSystem | undefined {
  try {
    const stored = globalThis.localStorage?.getItem(storageKey);
    return isUnitSystem(stored) ? stored : undefined;
  } catch {
    return undefined;
  }
}

function store(system: UnitSystem): void {
  try {
    globalThis.localStorage?.setItem(storageKey, system);
  } catch {
    // Storage unavailable (private mode, blocked): the choice holds for this visit only.
  }
}
