import { Injectable } from '@angular/core';

const keyPrefix = 'flowlore.reading.';

/** Per lesson, the last heading the reader reached, remembered across visits when storage allows. */
@Injectable({ providedIn: 'root' })
export class ReadingPositionService {
  /** The id of the heading reached last time, if any. */
  recall(slug: string): string | undefined {
    try {
      return globalThis.localStorage?.getItem(keyPrefix + slug) ?? undefined;
    } catch {
      return undefined;
    }
  }

  remember(slug: string, headingId: string): void {
    try {
      globalThis.localStorage?.setItem(keyPrefix + slug, headingId);
    } catch {
      // Storage unavailable (private mode, blocked): the position holds for this visit only.
    }
  }
}
