import type { Server } from 'node:http';

/**
 * Stops accepting connections, lets in-flight requests finish, closes idle keep-alive
 * connections at once, and after `graceMs` closes whatever is still open. Resolves when the
 * server has closed; `forced` tells whether the grace period ran out.
 */
export function closeGracefully(server: Server, graceMs: number): Promise<{ forced: boolean }> {
  return new Promise((resolve) => {
    let forced = false;
    const timer = setTimeout(() => {
      forced = true;
      server.closeAllConnections();
    }, graceMs);
    timer.unref();
    server.close(() => {
      clearTimeout(timer);
      resolve({ forced });
    });
    server.closeIdleConnections();
  });
}
