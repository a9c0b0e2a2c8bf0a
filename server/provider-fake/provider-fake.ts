import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';

import express, { Router, type Express, type RequestHandler, type Response } from 'express';

import { closeGracefully } from '../http/graceful-shutdown';
import { checkoutSessionsRouter, expireDueSessions } from './checkout-sessions';
import { ProviderError, providerErrorHandler, unknownApiRoute } from './errors';
import { eventsRouter } from './events';
import { formBody, parseQuery } from './form-body';
import { idempotentPosts } from './idempotency';
import { newId } from './ids';
import { payPageRouter } from './pay-page';
import { paymentObjectsRouter } from './payment-intents';
import { refundsRouter } from './refunds';
import type { RequestContext } from './resources';
import { ProviderStore } from './store';
import { testControls, testControlsRouter, type TestControls } from './test-controls';
import { WebhookDispatcher, type WebhookOptions } from './webhooks';

/** The API version stripe 23.1.0 pins (cjs/apiVersion.js); events carry it as `api_version`. */
export const DEFAULT_API_VERSION = '2026-10-28.endive';

export interface ProviderFakeOptions {
  /** The one secret key the API accepts (`Authorization: Bearer <key>`). */
  readonly secretKey: string;
  readonly webhook?: WebhookOptions;
  readonly apiVersion?: string;
  /** Shown in the pay page's heading. Default "Flowlore". */
  readonly businessName?: string;
  /** The pay page's origin in session URLs; default the Host the API was called on. */
  readonly publicUrl?: string;
  /** The clock (ms); default Date.now. Tests may also move it forward with `controls.advanceClock`. */
  readonly now?: () => number;
  /** How often sessions past `expires_at` are expired while running. Default 1000 ms. */
  readonly expirySweepMs?: number;
  /** Told about errors the fake did not expect (default: written to stderr). */
  readonly onUnexpectedError?: (error: unknown) => void;
}

export interface RunningProviderFake {
  /** `http://127.0.0.1:<port>` */
  readonly url: string;
  readonly port: number;
  readonly server: Server;
  stop(): Promise<void>;
}

export interface ProviderFake {
  readonly app: Express;
  readonly state: ProviderStore;
  readonly webhooks: WebhookDispatcher;
  readonly controls: TestControls;
  /** Listens (port 0: any free port) and sweeps expired sessions until stopped. */
  start(port?: number, host?: string): Promise<RunningProviderFake>;
}

/**
 * A local stand-in for the payment provider, enough of its REST API for the official SDK pointed at it
 * (`new Stripe(key, { host: '127.0.0.1', port, protocol: 'http' })`) to run every call Flowlore makes,
 * plus the hosted pay page, signed webhooks and test controls. State lives in memory.
 */
export function createProviderFake(options: ProviderFakeOptions): ProviderFake {
  const store = new ProviderStore(options.now ?? Date.now, options.apiVersion ?? DEFAULT_API_VERSION);
  const webhooks = new WebhookDispatcher(store, options.webhook ?? {});
  const controls = testControls(store, webhooks);
  const onUnexpected = options.onUnexpectedError ?? ((error: unknown) => process.stderr.write(`[provider-fake] ${String(error instanceof Error ? error.stack : error)}\n`));

  const app = express();
  app.disable('x-powered-by');
  app.set('query parser', parseQuery);
  app.use('/_test', testControlsRouter(controls));
  app.use('/pay', payPageRouter(store, { businessName: options.businessName ?? 'Flowlore' }));
  app.use('/v1', apiRouter(store, options));
  app.use((req, _res, next) => next(ProviderError.invalidRequest(`Unrecognized request URL (${req.method}: ${req.path}).`)));
  app.use(providerErrorHandler(onUnexpected));

  return {
    app,
    state: store,
    webhooks,
    controls,
    async start(port = 0, host = '127.0.0.1') {
      const server = await new Promise<Server>((resolve, reject) => {
        const listening = app.listen(port, host, (error?: Error) => (error ? reject(error) : resolve(listening)));
      });
      const sweep = setInterval(() => expireDueSessions(store), options.expirySweepMs ?? 1000);
      sweep.unref();
      const bound = (server.address() as AddressInfo).port;
      return {
        url: `http://${host.includes(':') ? `[${host}]` : host}:${bound}`,
        port: bound,
        server,
        async stop() {
          clearInterval(sweep);
          await webhooks.stop();
          await closeGracefully(server, 2000);
        },
      };
    },
  };
}

function apiRouter(store: ProviderStore, options: ProviderFakeOptions): Router {
  const requestContext = (res: Response): RequestContext => res.locals['providerRequest'] as RequestContext;
  const baseUrl = (res: Response): string => options.publicUrl ?? `${res.req.protocol}://${res.req.get('host') ?? '127.0.0.1'}`;
  const api = Router();
  api.use(identifyRequest(store), whenDown(store), secretKeyCheck(options.secretKey), ...formBody(), idempotentPosts(() => store.nowMs()));
  api.use('/checkout/sessions', checkoutSessionsRouter({ store, baseUrl, requestContext }));
  api.use('/refunds', refundsRouter({ store, requestContext }));
  api.use('/events', eventsRouter(store));
  api.use(paymentObjectsRouter(store));
  api.use(unknownApiRoute);
  return api;
}

/** Every answer carries a `Request-Id`, as the provider's do; events made by the request name it. */
function identifyRequest(store: ProviderStore): RequestHandler {
  return (req, res, next) => {
    const request: RequestContext = { id: newId('req', 14), idempotency_key: req.get('Idempotency-Key') ?? null };
    res.locals['providerRequest'] = request;
    res.set({ 'Request-Id': request.id as string, 'Stripe-Version': req.get('Stripe-Version') ?? store.apiVersion });
    next();
  };
}

function whenDown(store: ProviderStore): RequestHandler {
  return (_req, _res, next) => next(store.down ? ProviderError.unavailable() : undefined);
}

/**
 * `Authorization: Bearer <secret key>` (what the SDK sends), or Basic with the key as the user name
 * (`curl -u sk_test_…:`), both as the provider accepts; anything else is its 401, the key masked.
 */
function secretKeyCheck(secretKey: string): RequestHandler {
  if (!secretKey) throw new Error('The provider fake needs a secret key.');
  return (req, _res, next) => {
    const key = presentedKey(req.get('Authorization') ?? '');
    if (!key) next(ProviderError.missingApiKey());
    else if (key !== secretKey) next(ProviderError.invalidApiKey(key));
    else next();
  };
}

function presentedKey(header: string): string | undefined {
  const bearer = /^Bearer\s+(\S+)$/i.exec(header)?.[1];
  if (bearer) return bearer;
  const basic = /^Basic\s+(\S+)$/i.exec(header)?.[1];
  return basic ? Buffer.from(basic, 'base64').toString('utf8').split(':')[0] || undefined : undefined;
}
