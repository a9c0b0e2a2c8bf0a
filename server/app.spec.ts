import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

import request from 'supertest';
import type { DataSource } from 'typeorm';

import { createApp } from './app';
import { silentLogger, testConfig, testDataSource } from './testing/database';

describe('the Express app', () => {
  let dataSource: DataSource;
  let clientDir: string;
  let app: ReturnType<typeof createApp>;

  beforeAll(async () => {
    dataSource = testDataSource();
    await dataSource.initialize();
    clientDir = mkdtempSync(join(tmpdir(), 'flowlore-client-'));
    writeFileSync(join(clientDir, 'index.html'), '<!doctype html><title>Flowlore</title><fl-root></fl-root>');
    writeFileSync(join(clientDir, 'main-ABCD1234.js'), 'console.log(1)');
    app = createApp({ config: testConfig({ clientDir }), dataSource, logger: silentLogger });
  });

  afterAll(async () => {
    await dataSource.destroy();
    rmSync(clientDir, { recursive: true, force: true });
  });

  describe('API errors (RFC 9457 problem+json)', () => {
    it('answers an unknown API route with a 404 problem', async () => {
      const res = await request(app).get('/api/no-such-thing?x=1');
      expect(res.status).toBe(404);
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(res.body).toEqual({
        type: 'about:blank',
        title: 'Not found',
        status: 404,
        detail: 'There is no API route GET /api/no-such-thing.',
        instance: '/api/no-such-thing?x=1',
      });
    });

    it('answers an unknown API route with a 404 problem even when the client asks for HTML', async () => {
      const res = await request(app).get('/api/missing').set('Accept', 'text/html');
      expect(res.status).toBe(404);
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    });

    it('answers a body that is not JSON with a 400 problem naming the body', async () => {
      const res = await request(app).post('/api/health').set('Content-Type', 'application/json').send('{"broken":');
      expect(res.status).toBe(400);
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(res.body.errors).toEqual([expect.objectContaining({ field: 'body' })]);
    });

    it('refuses an oversized body with a 413 problem', async () => {
      const res = await request(app).post('/api/health').set('Content-Type', 'application/json').send(JSON.stringify({ x: 'y'.repeat(200_000) }));
      expect(res.status).toBe(413);
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    });
  });

  describe('security headers', () => {
    it('sends a Content-Security-Policy that allows no inline script', async () => {
      const res = await request(app).get('/api/health');
      const csp: string = res.headers['content-security-policy'];
      const scriptSrc = csp.split(';').find((d) => d.startsWith('script-src'));
      expect(scriptSrc).toBe("script-src 'self'");
      expect(csp).toContain("object-src 'none'");
      expect(csp).toContain("frame-ancestors 'none'");
      expect(res.headers['x-powered-by']).toBeUndefined();
      expect(res.headers['x-content-type-options']).toBe('nosniff');
    });
  });

  describe('the built client', () => {
    it('serves index.html for deep links so the Angular router can take over', async () => {
      const res = await request(app).get('/calculators/air-density').set('Accept', 'text/html');
      expect(res.status).toBe(200);
      expect(res.text).toContain('<fl-root>');
      expect(res.headers['cache-control']).toBe('no-cache');
    });

    it('caches hashed bundles for a year', async () => {
      const res = await request(app).get('/main-ABCD1234.js');
      expect(res.status).toBe(200);
      expect(res.headers['cache-control']).toContain('immutable');
    });

    it('does not answer non-HTML requests for unknown files with the page', async () => {
      const res = await request(app).get('/missing.png').set('Accept', 'image/png');
      expect(res.status).toBe(404);
    });
  });
});
