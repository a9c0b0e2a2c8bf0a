import type { ServerResponse } from 'node:http';

import type { RequestHandler } from 'express';
import expressStaticGzip from 'express-static-gzip';

/** Build output names carry an 8-character content hash (`main-AB12CD34.js`); media files live in `media/`. */
const HASHED_FILE = /-[A-Z0-9]{8}\.(js|css|woff2?|ttf|svg|png)$/;

export interface ClientAppOptions {
  /**
   * Serve the service worker's kill switch (`safety-worker.js`) in place of `ngsw-worker.js`: every
   * browser that checks for an update unregisters the worker and drops its caches (README, "Turning
   * the service worker off").
   */
  readonly serviceWorkerOff?: boolean;
}

/**
 * Serves the built Angular app. The build writes Brotli and gzip copies beside every compressible
 * file (`server/devstack/client-build.mjs`); express-static-gzip sends the best copy the request's
 * Accept-Encoding allows, with `Vary: Accept-Encoding` and the original file's Content-Type. Hashed
 * files are cached for a year; everything else, index.html above all, is revalidated on every use
 * (`no-cache`). Every other GET for a page gets index.html, so the client's router takes over.
 */
export function clientApp(clientDir: string, options: ClientAppOptions = {}): ClientHandlers {
  // Hashed files never change under their name: no validators (ETag, Last-Modified), which a
  // browser would never use on an immutable file, only bytes on every response.
  const hashedFiles = staticFiles(clientDir, { immutable: true });
  const otherFiles = staticFiles(clientDir, { immutable: false });
  const assets: RequestHandler = (req, res, next) => {
    if (!isRead(req.method) || !isHashedAsset(req.path)) {
      next();
      return;
    }
    // A script, style sheet, font or image is not a document: the page-level security headers
    // (CSP, framing, referrer…) mean nothing on it, and on 30 files a page they cost ~15 KB.
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Cross-Origin-Resource-Policy', 'same-origin');
    hashedFiles(req, res, next);
  };
  const pages: RequestHandler = (req, res, next) => {
    if (!isRead(req.method)) {
      next();
      return;
    }
    if (options.serviceWorkerOff && req.path === '/ngsw-worker.js') req.url = '/safety-worker.js';
    otherFiles(req, res, () => {
      // A missing file (an old chunk, a typo) is a 404, never index.html served as script.
      const isPage = !/\.[A-Za-z0-9]+$/.test(req.path);
      if (!isPage || !req.accepts('html')) {
        next();
        return;
      }
      // Any page path gets index.html, from its precompressed copies like every other file (no
      // built client: it falls through to the 404 like any missing file).
      const asked = req.url;
      req.url = '/index.html';
      otherFiles(req, res, (error?: unknown) => {
        req.url = asked;
        next(error);
      });
    });
  };
  return { assets, pages };
}

export interface ClientHandlers {
  /** Hashed files (scripts, styles, fonts, media): mount ahead of the page security headers. */
  readonly assets: RequestHandler;
  /** index.html for every page path, the worker, the manifest, icons: mount after them. */
  readonly pages: RequestHandler;
}

function staticFiles(clientDir: string, { immutable }: { immutable: boolean }): RequestHandler {
  return expressStaticGzip(clientDir, {
    enableBrotli: true,
    orderPreference: ['br', 'gzip'],
    index: false,
    serveStatic: {
      index: false,
      etag: !immutable,
      lastModified: !immutable,
      acceptRanges: !immutable,
      setHeaders: (res: ServerResponse) => {
        res.setHeader('Cache-Control', immutable ? 'public, max-age=31536000, immutable' : 'no-cache');
        // Identity answers vary too: a shared cache must not hand them to a client that takes Brotli.
        res.setHeader('Vary', 'Accept-Encoding');
      },
    },
  });
}

/** express-static-gzip marks a compressed answer before serve-static decides: only reads reach it. */
function isRead(method: string): boolean {
  return method === 'GET' || method === 'HEAD';
}

function isHashedAsset(path: string): boolean {
  return HASHED_FILE.test(path) || path.startsWith('/media/');
}
