import type { RequestHandler } from 'express';

import { ProviderError } from './errors';

// The provider keeps a key's first result for at least 24 hours (its API reference on idempotent requests).
const KEEP_MS = 24 * 3600 * 1000;
const MAX_KEY_LENGTH = 255;

interface SavedResponse {
  readonly fingerprint: string;
  readonly savedAtMs: number;
  /** Undefined while the first request with the key is still being answered. */
  response?: { readonly status: number; readonly body: unknown };
}

/**
 * Idempotency-Key on POSTs, as the provider's API reference describes it: the first answer for a key
 * is saved and replayed (header `Idempotent-Replayed: true`) when the same request comes again (the SDK
 * retries POSTs with the same key); the same key with another endpoint or other parameters is an
 * idempotency_error (400, which the SDK raises as StripeIdempotencyError). A request refused before it
 * ran (a 400 on its parameters, 401, 404) saves nothing, so the key can be used again.
 */
export function idempotentPosts(now: () => number): RequestHandler {
  const saved = new Map<string, SavedResponse>();
  return (req, res, next) => {
    const key = req.get('Idempotency-Key');
    if (req.method !== 'POST' || !key) {
      next();
      return;
    }
    if (key.length > MAX_KEY_LENGTH) throw ProviderError.invalidRequest(`Idempotency-Key must be at most ${MAX_KEY_LENGTH} characters.`);
    forgetOld(saved, now());
    res.set('Idempotency-Key', key);
    const fingerprint = JSON.stringify([req.path, canonical(req.body)]);
    const earlier = saved.get(key);
    if (earlier) {
      if (earlier.fingerprint !== fingerprint) throw ProviderError.idempotencyMismatch(key);
      if (!earlier.response) {
        throw new ProviderError(409, {
          type: 'idempotency_error',
          message: 'There is currently another in-progress request using this Idempotent Key (that probably means you submitted twice, and the other request is still going through).',
        });
      }
      res.set('Idempotent-Replayed', 'true').status(earlier.response.status).json(earlier.response.body);
      return;
    }
    const entry: SavedResponse = { fingerprint, savedAtMs: now() };
    saved.set(key, entry);
    const send = res.json.bind(res);
    res.json = (body: unknown) => {
      if (res.statusCode < 400 || res.statusCode === 402) entry.response = { status: res.statusCode, body: structuredClone(body) };
      else saved.delete(key);
      return send(body);
    };
    next();
  };
}

function forgetOld(saved: Map<string, SavedResponse>, nowMs: number): void {
  for (const [key, entry] of saved) {
    if (nowMs - entry.savedAtMs <= KEEP_MS) break; // kept in insertion order: the rest are newer
    saved.delete(key);
  }
}

/** The same parameters in any order give the same text. */
function canonical(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(canonical);
  if (typeof value === 'object' && value !== null) {
    return Object.fromEntries(
      Object.keys(value)
        .sort()
        .map((key) => [key, canonical((value as Record<string, unknown>)[key])]),
    );
  }
  return value;
}
