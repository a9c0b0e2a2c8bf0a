import { loadConfig } from './config';

describe('loadConfig', () => {
  const url = 'postgres://u:p@127.0.0.1:5432/flowlore';

  it('applies the documented defaults', () => {
    const config = loadConfig({ DATABASE_URL: url });
    expect(config).toMatchObject({ env: 'development', host: '127.0.0.1', port: 4300, trustProxyHops: 0, logLevel: 'info' });
  });

  it('reads the environment', () => {
    const config = loadConfig({ DATABASE_URL: url, PORT: '8080', HOST: '0.0.0.0', TRUST_PROXY_HOPS: '2', NODE_ENV: 'production' });
    expect(config).toMatchObject({ port: 8080, host: '0.0.0.0', trustProxyHops: 2, env: 'production' });
  });

  it('names every bad setting at once', () => {
    expect(() => loadConfig({ DATABASE_URL: 'mysql://x', PORT: 'eighty' })).toThrow(/DATABASE_URL[\s\S]*PORT|PORT[\s\S]*DATABASE_URL/);
  });

  it('requires a database URL', () => {
    expect(() => loadConfig({})).toThrow(/DATABASE_URL/);
  });
});
