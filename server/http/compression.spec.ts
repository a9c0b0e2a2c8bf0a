import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { request as httpRequest, type IncomingHttpHeaders, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';

import type { DataSource } from 'typeorm';

import { createApp } from '../app';
import { LessonStore } from '../lessons/lesson-store';
import { silentLogger, testConfig, testDataSource } from '../testing/database';

/**
 * Compressed delivery, read as the bytes on the wire: Node's http client, unlike supertest, never
 * decodes a body, so each test sees exactly the encoding the server chose.
 */
interface RawResponse {
  status: number;
  headers: IncomingHttpHeaders;
  body: Buffer;
}

function rawRequest(server: Server, path: string, headers: Record<string, string> = {}, method = 'GET', body?: string): Promise<RawResponse> {
  const { port } = server.address() as AddressInfo;
  return new Promise((done, fail) => {
    const req = httpRequest({ host: '127.0.0.1', port, path, method, headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => done({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
    });
    req.on('error', fail);
    req.end(body);
  });
}

/** Listens on a free loopback port; resolves once the port is bound. */
function listen(app: ReturnType<typeof createApp>): Promise<Server> {
  return new Promise((done) => {
    const server = app.listen(0, '127.0.0.1', () => done(server));
  });
}

function decoded(res: RawResponse): Buffer {
  const encoding = res.headers['content-encoding'];
  if (encoding === 'br') return brotliDecompressSync(res.body);
  if (encoding === 'gzip') return gunzipSync(res.body);
  return res.body;
}

// The real build output: `npm test` builds before it tests, and the build's own step writes the
// .br and .gz copies (server/devstack/client-build.mjs), so these tests check that step too.
const builtClient = resolve('dist/client/browser');

describe('compressed delivery', () => {
  let dataSource: DataSource;
  let server: Server;
  let mainScript: string;

  beforeAll(async () => {
    if (!existsSync(join(builtClient, 'index.html'))) throw new Error('no built client in dist/client/browser: run `npm run build` (npm test does)');
    mainScript = readdirSync(builtClient).find((name) => /^main-[A-Z0-9]{8}\.js$/.test(name)) ?? '';
    dataSource = testDataSource();
    await dataSource.initialize();
    const app = createApp({ config: testConfig({ clientDir: builtClient }), dataSource, logger: silentLogger });
    server = await listen(app);
  });

  afterAll(async () => {
    server.close();
    await dataSource.destroy();
  });

  describe('hashed static files, compressed once by the build', () => {
    it('sends Brotli to a browser that accepts it, with Vary, the script type and the year-long cache', async () => {
      const res = await rawRequest(server, `/${mainScript}`, { 'Accept-Encoding': 'gzip, deflate, br, zstd' });
      expect(res.status).toBe(200);
      expect(res.headers['content-encoding']).toBe('br');
      expect(res.headers['vary']).toMatch(/Accept-Encoding/i);
      expect(res.headers['content-type']).toMatch(/^text\/javascript/);
      expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
      expect(decoded(res).equals(readFileSync(join(builtClient, mainScript)))).toBe(true);
      expect(res.body.length).toBeLessThan(readFileSync(join(builtClient, mainScript)).length / 3);
    });

    it('sends gzip when the browser takes gzip only', async () => {
      const res = await rawRequest(server, `/${mainScript}`, { 'Accept-Encoding': 'gzip' });
      expect(res.headers['content-encoding']).toBe('gzip');
      expect(res.headers['vary']).toMatch(/Accept-Encoding/i);
      expect(decoded(res).equals(readFileSync(join(builtClient, mainScript)))).toBe(true);
    });

    it('sends the file as it is when the request accepts neither, still with Vary', async () => {
      const res = await rawRequest(server, `/${mainScript}`);
      expect(res.headers['content-encoding']).toBeUndefined();
      expect(res.headers['vary']).toMatch(/Accept-Encoding/i);
      expect(res.body.equals(readFileSync(join(builtClient, mainScript)))).toBe(true);
    });

    it('carries no page security headers on a script, but keeps nosniff', async () => {
      const res = await rawRequest(server, `/${mainScript}`, { 'Accept-Encoding': 'br' });
      expect(res.headers['content-security-policy']).toBeUndefined();
      expect(res.headers['x-content-type-options']).toBe('nosniff');
    });

    it('answers a chunk that is not there with 404, never with the page', async () => {
      const res = await rawRequest(server, '/chunk-ZZZZZZZZ.js', { Accept: '*/*' });
      expect(res.status).toBe(404);
    });
  });

  describe('pages and the service worker', () => {
    it('serves index.html for a deep link from its Brotli copy, revalidated on every use, with the CSP', async () => {
      const res = await rawRequest(server, '/calculators/boost', { Accept: 'text/html', 'Accept-Encoding': 'br' });
      expect(res.status).toBe(200);
      expect(res.headers['content-encoding']).toBe('br');
      expect(res.headers['vary']).toMatch(/Accept-Encoding/i);
      expect(res.headers['cache-control']).toBe('no-cache');
      expect(res.headers['content-security-policy']).toContain("script-src 'self'");
      expect(decoded(res).toString()).toContain('<fl-root>');
    });

    it('serves the worker and its manifest with no-cache, so an update is always seen', async () => {
      for (const file of ['/ngsw-worker.js', '/ngsw.json', '/manifest.webmanifest']) {
        const res = await rawRequest(server, file, { 'Accept-Encoding': 'br' });
        expect({ file, status: res.status, cache: res.headers['cache-control'] }).toEqual({ file, status: 200, cache: 'no-cache' });
      }
      const manifest = await rawRequest(server, '/manifest.webmanifest');
      expect(manifest.headers['content-type']).toMatch(/^application\/manifest\+json/);
    });

    it('serves the kill switch in place of the worker when SERVICE_WORKER_OFF is set', async () => {
      const off = createApp({ config: testConfig({ clientDir: builtClient, serviceWorkerOff: true }), dataSource, logger: silentLogger });
      const offServer = await listen(off);
      try {
        const res = await rawRequest(offServer, '/ngsw-worker.js');
        expect(res.status).toBe(200);
        expect(res.headers['cache-control']).toBe('no-cache');
        expect(res.body.equals(readFileSync(join(builtClient, 'safety-worker.js')))).toBe(true);
      } finally {
        offServer.close();
      }
    });
  });

  describe('API answers', () => {
    const boost = JSON.stringify({ inputs: { boostPressure: { value: 10, unit: 'psi' }, ambientPressure: { value: 14.7, unit: 'psi' }, inletTemperature: { value: 25, unit: 'degC' }, compressorEfficiency: { value: 72, unit: '%' } } });

    it('compresses a calculator answer over 1 KB', async () => {
      const res = await rawRequest(server, '/api/calculators/boost', { 'Content-Type': 'application/json', 'Accept-Encoding': 'br, gzip' }, 'POST', boost);
      expect(res.status).toBe(200);
      expect(res.headers['content-encoding']).toBe('br');
      const answer = decoded(res);
      expect(answer.length).toBeGreaterThan(1024);
      expect(JSON.parse(answer.toString()).outputs).toBeDefined();
    });

    it('leaves an answer under 1 KB as it is', async () => {
      const res = await rawRequest(server, '/api/health', { 'Accept-Encoding': 'br, gzip' });
      expect(res.status).toBe(200);
      expect(res.headers['content-encoding']).toBeUndefined();
    });
  });
});

describe('lessons, compressed once at render time', () => {
  const dir = mkdtempSync(join(tmpdir(), 'flowlore-lessons-encoded-'));
  const prose = 'Pressure drop across a part is what the bench reads. '.repeat(80);
  writeFileSync(
    join(dir, '01-first.md'),
    [
      '---',
      'title: Lesson one',
      'slug: first',
      'order: 1',
      'summary: A lesson written for the compression tests.',
      'minutes: 15',
      'free: true',
      'objectives:',
      '  - First objective',
      '  - Second objective',
      '  - Third objective',
      '---',
      '',
      '## Start here',
      '',
      prose,
      '',
    ].join('\n'),
  );
  let server: Server;

  beforeAll(async () => {
    const app = createApp({ config: testConfig(), dataSource: testDataSource(), logger: silentLogger, lessons: new LessonStore(dir) });
    server = await listen(app);
  });

  afterAll(() => {
    server.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it('gives each encoding its own strong ETag, and the same content under each', async () => {
    const br = await rawRequest(server, '/api/lessons/first', { 'Accept-Encoding': 'br' });
    const gzip = await rawRequest(server, '/api/lessons/first', { 'Accept-Encoding': 'gzip' });
    const identity = await rawRequest(server, '/api/lessons/first');
    expect([br.headers['content-encoding'], gzip.headers['content-encoding'], identity.headers['content-encoding']]).toEqual(['br', 'gzip', undefined]);
    const tags = [br, gzip, identity].map((res) => res.headers['etag']);
    for (const tag of tags) expect(tag).toMatch(/^"[\w-]+"$/);
    expect(new Set(tags).size).toBe(3);
    for (const res of [br, gzip, identity]) expect(res.headers['vary']).toMatch(/Accept-Encoding/i);
    expect(decoded(br).equals(identity.body)).toBe(true);
    expect(decoded(gzip).equals(identity.body)).toBe(true);
    expect(br.body.length).toBeLessThan(identity.body.length / 3);
  });

  it('answers If-None-Match with 304 per representation', async () => {
    const br = await rawRequest(server, '/api/lessons/first', { 'Accept-Encoding': 'br' });
    const again = await rawRequest(server, '/api/lessons/first', { 'Accept-Encoding': 'br', 'If-None-Match': br.headers['etag'] as string });
    expect(again.status).toBe(304);
    expect(again.body.length).toBe(0);
    // The Brotli tag does not validate the gzip representation.
    const other = await rawRequest(server, '/api/lessons/first', { 'Accept-Encoding': 'gzip', 'If-None-Match': br.headers['etag'] as string });
    expect(other.status).toBe(200);
    expect(other.headers['content-encoding']).toBe('gzip');
  });
});
