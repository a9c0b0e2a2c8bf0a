/** The reader's theme choice: a fixed light or dark scheme, or whatever the system asks for. */
export type ThemePreference = 'light' | 'dark' | 'system';

const storageKey = 'flowlore.theme';

export function isThemePreference(value: unknown): value is ThemePreference {
  return value === 'light' || value === 'dark' || value === 'system';
}

/** The stored choice, or 'system'. Storage can throw (private mode, blocked cookies): then 'system'. */
export function readThemePreference(): ThemePreference {
  try {
    const stored = globalThis.localStorage?.getItem(storageKey);
    return isThemePreference(stored) ? stored : 'system';
  } catch {
    return 'system';
  }
}

/** Remembers the choice when storage allows; the theme still applies for this visit if it does not. */
export function storeThemePreference(preference: ThemePreference): void {
  try {
    globalThis.localStorage?.setItem(storageKey, preference);
  } catch {
    // Storage unavailable: nothing to remember the choice in.
  }
}

/** Sets data-theme on <html>; the stylesheet turns it into color-scheme (see styles/_theme.scss). */
export function applyThemePreference(preference: ThemePreference, root: HTMLElement): void {
  root.setAttribute('data-theme', preference);
}
