import { LRUCache } from 'lru-cache';

import { evaluate, type CalculationOutcome, type CalculationRequest } from '../../shared/airflow';

/**
 * The engine is pure, so equal requests give equal answers: shared links, lesson presets and
 * quiz checks repeat the same inputs often. A bounded LRU keeps the recent ones per process
 * (no per-user state: any instance computes the same outcome on a miss).
 */
export class CalculationCache {
  private readonly outcomes: LRUCache<string, CalculationOutcome>;

  constructor(maxEntries = 2000) {
    this.outcomes = new LRUCache({ max: maxEntries });
  }

  evaluate(id: string, request: CalculationRequest): CalculationOutcome {
    const key = `${id}\n${JSON.stringify(request)}`;
    let outcome = this.outcomes.get(key);
    if (!outcome) {
      outcome = evaluate(id, request);
      this.outcomes.set(key, outcome);
    }
    return outcome;
  }

  get size(): number {
    return this.outcomes.size;
  }
}
