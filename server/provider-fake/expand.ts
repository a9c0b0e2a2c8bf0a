import { ProviderError } from './errors';
import type { ProviderStore } from './store';

type Resolver = (store: ProviderStore, id: string) => object | undefined;

// Fields holding an id that `expand[]` may swap for the object, as the provider's API reference
// describes expansion; only the ones Flowlore reads are known here.
const RESOLVERS: Record<string, Resolver> = {
  payment_intent: (store, id) => store.paymentIntents.get(id),
  latest_charge: (store, id) => store.charges.get(id),
  charge: (store, id) => store.charges.get(id),
};

/**
 * Applies `expand[]` paths (`payment_intent`, `payment_intent.latest_charge`) to a copy of an object.
 * `special` answers fields that are not ids (a session's `line_items`). A field that cannot be
 * expanded is a 400, as the provider answers (message from memory).
 */
export function expandObject<T extends object>(
  store: ProviderStore,
  object: T,
  paths: readonly string[] | undefined,
  special: Record<string, () => unknown> = {},
): T {
  const copy = structuredClone(object) as Record<string, unknown>;
  for (const path of paths ?? []) expandPath(store, copy, path.split('.'), path, special);
  return copy as T;
}

function expandPath(
  store: ProviderStore,
  target: Record<string, unknown>,
  segments: readonly string[],
  fullPath: string,
  special: Record<string, () => unknown>,
): void {
  const [field, ...rest] = segments;
  if (!field) return;
  const current = target[field];
  const makeSpecial = special[field];
  if (makeSpecial && current === undefined) {
    target[field] = makeSpecial();
  } else if (typeof current === 'string' && RESOLVERS[field]) {
    const found = RESOLVERS[field](store, current);
    if (!found) throw cannotExpand(fullPath);
    target[field] = structuredClone(found);
  } else if (current === null) {
    return;
  } else if (typeof current !== 'object' || !(field in target)) {
    throw cannotExpand(fullPath);
  }
  const next = target[field];
  if (rest.length && typeof next === 'object' && next !== null) expandPath(store, next as Record<string, unknown>, rest, fullPath, {});
}

function cannotExpand(path: string): ProviderError {
  return ProviderError.invalidRequest(`This property cannot be expanded (${path}).`, 'expand');
}
