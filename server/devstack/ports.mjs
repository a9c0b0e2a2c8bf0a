// Free TCP ports on loopback. Each service of the local stack asks for its usual port and, when
// something else holds it (another checkout's `npm test`, a stray process), takes the next free one
// and says so, instead of stopping.
import { createServer } from 'node:net';

import { log } from './process.mjs';

/** True when 127.0.0.1:port can be bound now (probed by listening on it and closing again). */
export function isPortFree(port) {
  return new Promise((resolve) => {
    const probe = createServer();
    probe.once('error', () => resolve(false));
    probe.listen({ port, host: '127.0.0.1', exclusive: true }, () => probe.close(() => resolve(true)));
  });
}

/**
 * The first free port from `preferred` upwards, skipping `avoid` (ports this run already handed to
 * another service). `holder` guesses who has the preferred port, for the log line.
 */
export async function freePort(preferred, { holder, avoid = [], tries = 50 } = {}) {
  const last = Math.min(preferred + tries - 1, 65535);
  for (let port = preferred; port <= last; port++) {
    if (avoid.includes(port) || !(await isPortFree(port))) continue;
    if (port !== preferred) log(`port ${preferred} is taken${holder ? ` (${holder}?)` : ''}; using ${port}`);
    return port;
  }
  throw new Error(`no free port on 127.0.0.1 from ${preferred} to ${last}`);
}
