import { parseArgs } from 'node:util';

import { createProviderFake } from './provider-fake';

const USAGE = `usage: cli.js --secret-key sk_test_… [--port 12111] [--host 127.0.0.1]
         [--webhook-url http://127.0.0.1:4000/api/payments/webhook --webhook-secret whsec_…]
         [--retry-base-ms 1000] [--max-attempts 5] [--business-name Flowlore] [--public-url http://…]`;

/** Runs the payment provider's local fake on its own; prints its URL; stops on SIGINT/SIGTERM. */
async function main(argv: readonly string[]): Promise<void> {
  const { values } = parseArgs({
    args: [...argv],
    options: {
      port: { type: 'string', default: '12111' },
      host: { type: 'string', default: '127.0.0.1' },
      'secret-key': { type: 'string' },
      'webhook-url': { type: 'string' },
      'webhook-secret': { type: 'string' },
      'retry-base-ms': { type: 'string', default: '1000' },
      'max-attempts': { type: 'string', default: '5' },
      'business-name': { type: 'string' },
      'public-url': { type: 'string' },
    },
  });
  const secretKey = values['secret-key'];
  const port = Number(values.port);
  const webhookUrl = values['webhook-url'];
  const webhookSecret = values['webhook-secret'];
  if (!secretKey || !Number.isInteger(port) || port < 0 || port > 65535 || Boolean(webhookUrl) !== Boolean(webhookSecret)) {
    throw new Error(USAGE);
  }
  const fake = createProviderFake({
    secretKey,
    businessName: values['business-name'],
    publicUrl: values['public-url'],
    webhook: {
      url: webhookUrl,
      secret: webhookSecret,
      retryBaseMs: Number(values['retry-base-ms']),
      maxAttempts: Number(values['max-attempts']),
    },
  });
  const running = await fake.start(port, values.host);
  process.stdout.write(`Payment provider fake (local test only) at ${running.url}\n`);
  if (!webhookUrl) process.stderr.write('[provider-fake] no --webhook-url: events are recorded but not sent\n');

  let stopping = false;
  const stop = async () => {
    if (stopping) return;
    stopping = true;
    await running.stop();
    process.exit(0);
  };
  process.on('SIGINT', () => void stop());
  process.on('SIGTERM', () => void stop());
}

main(process.argv.slice(2)).catch((err: unknown) => {
  process.stderr.write(`${err instanceof Error ? err.message : String(err)}\n`);
  process.exit(1);
});
