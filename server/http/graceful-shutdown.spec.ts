import { createServer, request as httpRequest, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';

import express from 'express';

import { closeGracefully } from './graceful-shutdown';

function get(port: number, path: string): Promise<{ status: number; body: string }> {
  return new Promise((resolve, reject) => {
    const req = httpRequest({ host: '127.0.0.1', port, path, agent: false }, (res) => {
      let body = '';
      res.on('data', (chunk) => (body += chunk));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, body }));
    });
    req.on('error', reject);
    req.end();
  });
}

describe('closeGracefully', () => {
  let server: Server;
  let port: number;
  let release: () => void = () => undefined;

  beforeEach(async () => {
    const app = express();
    // A slow request that finishes only when the test says so.
    app.get('/slow', (_req, res) => {
      release = () => res.json({ finished: true });
    });
    server = createServer(app);
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    port = (server.address() as AddressInfo).port;
  });

  it('lets an in-flight request finish, then closes', async () => {
    const inFlight = get(port, '/slow');
    await new Promise((r) => setTimeout(r, 50));
    const closed = closeGracefully(server, 5000);
    // New connections are refused while the old request is still running.
    await expect(get(port, '/slow')).rejects.toThrow(/ECONNREFUSED/);
    release();
    await expect(inFlight).resolves.toEqual({ status: 200, body: '{"finished":true}' });
    await expect(closed).resolves.toEqual({ forced: false });
  });

  it('closes what is still open when the grace period runs out', async () => {
    const inFlight = get(port, '/slow').catch((error: Error) => error.message);
    await new Promise((r) => setTimeout(r, 50));
    await expect(closeGracefully(server, 200)).resolves.toEqual({ forced: true });
    await expect(inFlight).resolves.toMatch(/socket hang up|ECONNRESET/);
  });
});
