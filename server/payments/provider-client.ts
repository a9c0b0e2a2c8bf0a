import Stripe from 'stripe';

import type { PaymentsConfig } from '../config';

/**
 * The official SDK, pointed at the provider (or at `server/provider-fake` through
 * PAYMENT_PROVIDER_URL: the constructor's host, port and protocol). Undefined when no secret key is
 * configured: buying is then switched off, with a clear message.
 */
export function providerClient(config: PaymentsConfig): Stripe | undefined {
  if (!config.secretKey) return undefined;
  const target = config.apiUrl ? new URL(config.apiUrl) : undefined;
  return new Stripe(config.secretKey, {
    maxNetworkRetries: 2,
    timeout: 10_000,
    ...(target
      ? { host: target.hostname, port: Number(target.port || (target.protocol === 'https:' ? 443 : 80)), protocol: target.protocol === 'https:' ? 'https' : 'http' }
      : {}),
  });
}
