import { loadConfig } from './config';

describe('loadConfig', () => {
  const url = 'postgres://u:p@127.0.0.1:5432/flowlore';

  it('applies the documented defaults', () => {
    const config = loadConfig({ DATABASE_URL: url });
    expect(config).toMatchObject({ env: 'development', host: '127.0.0.1', port: 4300, trustProxyHops: 0, logLevel: 'info' });
  });

  it('reads the environment', () => {
    const config = loadConfig({ DATABASE_URL: url, PORT: '8080', HOST: '0.0.0.0', TRUST_PROXY_HOPS: '2', NODE_ENV: 'production', SESSION_SECRET: 's'.repeat(40) });
    expect(config).toMatchObject({ port: 8080, host: '0.0.0.0', trustProxyHops: 2, env: 'production' });
  });

  it('requires a session secret in production only', () => {
    expect(() => loadConfig({ DATABASE_URL: url, NODE_ENV: 'production' })).toThrow(/SESSION_SECRET/);
    expect(loadConfig({ DATABASE_URL: url }).sessionSecret.length).toBeGreaterThanOrEqual(32);
  });

  it('allows a bcrypt cost below 12 in tests only', () => {
    expect(loadConfig({ DATABASE_URL: url }).passwordHashCost).toBe(12);
    expect(() => loadConfig({ DATABASE_URL: url, PASSWORD_HASH_COST: '4' })).toThrow(/PASSWORD_HASH_COST/);
    expect(loadConfig({ DATABASE_URL: url, NODE_ENV: 'test', PASSWORD_HASH_COST: '4' }).passwordHashCost).toBe(4);
  });

  it('reads the mail settings and the demo flag', () => {
    const config = loadConfig({ DATABASE_URL: url, SMTP_PORT: '2025', SMTP_SECURE: 'false', DEMO_MODE: 'true', APP_BASE_URL: 'https://flowlore.example/' });
    expect(config.mail).toMatchObject({ host: '127.0.0.1', port: 2025, secure: false });
    expect(config.demoMode).toBe(true);
    expect(config.appBaseUrl).toBe('https://flowlore.example');
    expect(loadConfig({ DATABASE_URL: url }).demoMode).toBe(false);
  });

  it('names every bad setting at once', () => {
    expect(() => loadConfig({ DATABASE_URL: 'mysql://x', PORT: 'eighty' })).toThrow(/DATABASE_URL[\s\S]*PORT|PORT[\s\S]*DATABASE_URL/);
  });

  it('reads the quiz folder, content/quizzes by default', () => {
    expect(loadConfig({ DATABASE_URL: url }).quizDir).toMatch(/content[\\/]quizzes$/);
    expect(loadConfig({ DATABASE_URL: url, QUIZ_DIR: '/srv/quizzes' }).quizDir).toBe('/srv/quizzes');
  });

  it('reads seat prices (tiers in cents) and the currency, and refuses bad tiers by name', () => {
    expect(loadConfig({ DATABASE_URL: url }).seatPricing).toEqual({
      currency: 'usd',
      tiers: [
        { fromSeats: 1, unitAmount: 4900 },
        { fromSeats: 10, unitAmount: 4400 },
        { fromSeats: 50, unitAmount: 3900 },
      ],
    });
    expect(loadConfig({ DATABASE_URL: url, SEAT_PRICES: '1:2500', SEAT_CURRENCY: 'EUR' }).seatPricing).toEqual({ currency: 'eur', tiers: [{ fromSeats: 1, unitAmount: 2500 }] });
    expect(() => loadConfig({ DATABASE_URL: url, SEAT_PRICES: '5:2500' })).toThrow(/SEAT_PRICES: The first tier must start at 1 seat/);
    expect(() => loadConfig({ DATABASE_URL: url, SEAT_CURRENCY: 'dollars' })).toThrow(/SEAT_CURRENCY/);
  });

  it('reads the payment provider settings, checks their shape, and leaves buying off without a key', () => {
    expect(loadConfig({ DATABASE_URL: url }).payments).toEqual({ secretKey: undefined, webhookSecret: undefined, apiUrl: undefined });
    const config = loadConfig({ DATABASE_URL: url, STRIPE_SECRET_KEY: 'sk_test_abc123', STRIPE_WEBHOOK_SECRET: 'whsec_abc123', PAYMENT_PROVIDER_URL: 'http://127.0.0.1:12111' });
    expect(config.payments).toEqual({ secretKey: 'sk_test_abc123', webhookSecret: 'whsec_abc123', apiUrl: 'http://127.0.0.1:12111' });
    // A bad key is named, never echoed.
    expect(() => loadConfig({ DATABASE_URL: url, STRIPE_SECRET_KEY: 'pk_test_oops-public' })).toThrow(/STRIPE_SECRET_KEY looks like/);
    expect(() => loadConfig({ DATABASE_URL: url, STRIPE_SECRET_KEY: 'pk_test_oops-public' })).not.toThrow(/pk_test_oops/);
  });

  it('requires a database URL', () => {
    expect(() => loadConfig({})).toThrow(/DATABASE_URL/);
  });
});
