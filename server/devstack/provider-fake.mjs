// The payment provider's local fake (server/provider-fake, built into dist/) for `npm start` and
// `npm test`: on loopback, with a secret key and a webhook signing secret made for this run, sending
// its signed events to the app's webhook. `npm start` asks for port 12111, `npm test` for 12211; when
// another run holds the port, the next free one is taken. Against the real provider (the keys set in
// the environment), neither command starts it.
import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { setTimeout as sleep } from 'node:timers/promises';

import { freePort } from './ports.mjs';
import { log } from './process.mjs';
import { root } from './paths.mjs';

async function answers(url) {
  try {
    // The API answers 401 without a key: it is up.
    const res = await fetch(`${url}/v1/checkout/sessions`, { signal: AbortSignal.timeout(1000) });
    return res.status === 401;
  } catch {
    return false;
  }
}

/** Starts the fake; resolves with its URL, the run's secrets and `stop()`. */
export async function startProviderFake({ port: preferred, webhookUrl }) {
  const port = await freePort(preferred, { holder: 'another payment provider fake' });
  const secretKey = `sk_test_local${randomBytes(12).toString('hex')}`;
  const webhookSecret = `whsec_local${randomBytes(16).toString('hex')}`;
  const url = `http://127.0.0.1:${port}`;
  const args = ['dist/api/server/provider-fake/cli.js', '--port', String(port), '--secret-key', secretKey, '--webhook-url', webhookUrl, '--webhook-secret', webhookSecret, '--retry-base-ms', '500'];
  const child = spawn(process.execPath, args, { cwd: root, stdio: ['ignore', 'ignore', 'inherit'] });
  let exited = false;
  child.on('exit', () => {
    exited = true;
  });
  for (let i = 0; i < 100 && !exited; i++) {
    if (await answers(url)) {
      log(`payment provider fake on ${url} (local test page; events to ${webhookUrl})`);
      return {
        url,
        secretKey,
        webhookSecret,
        stop: async () => {
          if (exited) return;
          child.kill('SIGTERM');
          for (let j = 0; j < 50 && !exited; j++) await sleep(100);
          if (!exited) child.kill('SIGKILL');
        },
      };
    }
    await sleep(100);
  }
  child.kill('SIGKILL');
  throw new Error(`the payment provider fake did not start on ${url}`);
}
