import { type Signal, linkedSignal } from '@angular/core';

/**
 * A signal of the latest defined value of `source`: while a resource loads its next page (its value
 * is undefined then), the table keeps showing the previous one instead of emptying.
 */
export function keepLast<T>(source: () => T | undefined): Signal<T | undefined> {
  return linkedSignal<T | undefined, T | undefined>({
    source,
    computation: (next, previous) => next ?? previous?.value,
  });
}
