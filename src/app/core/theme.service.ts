import { BreakpointObserver } from '@angular/cdk/layout';
import { DOCUMENT, Injectable, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { map } from 'rxjs';

import {
  ThemePreference,
  applyThemePreference,
  readThemePreference,
  storeThemePreference,
} from './theme-preference';

/** The reader's light / dark / system choice, remembered across visits. */
@Injectable({ providedIn: 'root' })
export class ThemeService {
  private readonly root = inject(DOCUMENT).documentElement;
  private readonly chosen = signal<ThemePreference>(readThemePreference());
  private readonly systemPrefersDark = toSignal(
    inject(BreakpointObserver)
      .observe('(prefers-color-scheme: dark)')
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );

  /** What the reader picked in the theme menu. */
  readonly preference = this.chosen.asReadonly();

  /** The scheme actually on screen, with 'system' resolved. */
  readonly scheme = computed<'light' | 'dark'>(() => {
    const preference = this.chosen();
    if (preference !== 'system') {
      return preference;
    }
    return this.systemPrefersDark() ? 'dark' : 'light';
  });

  constructor() {
    // main.ts applied the stored choice before bootstrap; apply again in case it never ran (tests).
    applyThemePreference(this.chosen(), this.root);
  }

  choose(preference: ThemePreference): void {
    this.chosen.set(preference);
    applyThemePreference(preference, this.root);
    storeThemePreference(preference);
  }
}
