import { LRUCache } from 'lru-cache';

import { evaluate, type CalculationOutcome, type CalculationRequest } from '../../shared/airflow';

/** An outcome with its result already serialised, so a repeat request costs no JSON.stringify. */
export type CachedOutcome = CalculationOutcome & { readonly json?: string };

/**
 * The engine is pure, so equal requests give equal answers: shared links, lesson presets and
 * quiz checks repeat the same inputs often. A bounded LRU keeps the recent ones per process
 * (no per-user state: any instance computes the same outcome on a miss).
 */
export class CalculationCache {
  private readonly outcomes: LRUCache<string, CachedOutcome>;

  constructor(maxEntries = 2000) {
    this.outcomes = new LRUCache({ max: maxEntries });
  }

  evaluate(id: string, request: CalculationRequest): CachedOutcome {
    const key = `${id}\n${JSON.stringify(request)}`;
    let outcome = this.outcomes.get(key);
    if (!outcome) {
      const fresh = evaluate(id, request);
      outcome = fresh.ok ? { ...fresh, json: JSON.stringify(fresh.result) } : fresh;
      this.outcomes.set(key, outcome);
    }
    return outcome;
  }

  get size(): number {
    return this.outcomes.size;
  }
}
