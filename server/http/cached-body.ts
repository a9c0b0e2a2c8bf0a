import { createHash } from 'node:crypto';
import { brotliCompressSync, constants as zlib, gzipSync } from 'node:zlib';

import type { Response } from 'express';

/** The encodings a cached body is stored in besides identity, best first. */
const ENCODINGS = ['br', 'gzip'] as const;
type Encoding = (typeof ENCODINGS)[number];

/** One representation: the bytes and their own strong ETag (RFC 9110 §8.8.3: one per representation). */
export interface Representation {
  readonly body: Buffer;
  readonly etag: string;
}

/** A JSON response body serialised and compressed once, kept in memory, with a strong ETag per encoding. */
export interface CachedBody {
  readonly json: string;
  readonly identity: Representation;
  readonly encoded: Readonly<Record<Encoding, Representation>>;
}

/**
 * Serialises `value` and compresses it now, at the highest Brotli quality and gzip level: done
 * once per render, so the cost is paid at start-up rather than per request.
 */
export function cacheJson(value: unknown): CachedBody {
  const json = JSON.stringify(value);
  const identity = Buffer.from(json, 'utf8');
  const tag = createHash('sha256').update(identity).digest('base64url').slice(0, 27);
  return {
    json,
    identity: { body: identity, etag: `"${tag}"` },
    encoded: {
      br: {
        body: brotliCompressSync(identity, {
          params: { [zlib.BROTLI_PARAM_QUALITY]: zlib.BROTLI_MAX_QUALITY, [zlib.BROTLI_PARAM_MODE]: zlib.BROTLI_MODE_TEXT, [zlib.BROTLI_PARAM_SIZE_HINT]: identity.length },
        }),
        etag: `"${tag}-br"`,
      },
      gzip: { body: gzipSync(identity, { level: zlib.Z_BEST_COMPRESSION }), etag: `"${tag}-gz"` },
    },
  };
}

/**
 * Sends the representation the request's Accept-Encoding prefers, with `Vary: Accept-Encoding`
 * and that representation's ETag; a matching If-None-Match gets 304 with no body.
 * `no-transform` keeps the compression middleware (and any proxy) from re-encoding it.
 */
export function sendCachedJson(res: Response, cached: CachedBody): void {
  const encoding = res.req.acceptsEncodings(...ENCODINGS, 'identity');
  const chosen = encoding === 'br' || encoding === 'gzip' ? cached.encoded[encoding] : cached.identity;
  res.vary('Accept-Encoding');
  res.set({ ETag: chosen.etag, 'Cache-Control': 'no-cache, no-transform' });
  if (res.req.fresh) {
    res.status(304).end();
    return;
  }
  if (chosen !== cached.identity) res.set('Content-Encoding', encoding as Encoding);
  res.type('application/json').send(chosen.body);
}
