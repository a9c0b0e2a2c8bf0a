import { Injectable, signal } from '@angular/core';

import { UnitSystem, isUnitSystem } from './unit-system';

const storageKey = 'flowlore.units';

/** The reader's preferred unit system, remembered across visits when storage allows. */
@Injectable({ providedIn: 'root' })
export class UnitSystemService {
  private readonly chosen = signal<UnitSystem>(readStored());

  readonly preference = this.chosen.asReadonly();

  choose(system: UnitSystem): void {
    this.chosen.set(system);
    try {
      globalThis.localStorage?.setItem(storageKey, system);
    } catch {
      // Storage unavailable (private mode, blocked): the choice holds for this visit only.
    }
  }
}

function readStored(): UnitSystem {
  try {
    const stored = globalThis.localStorage?.getItem(storageKey);
    return isUnitSystem(stored) ? stored : 'si';
  } catch {
    return 'si';
  }
}
