// The local mail catcher (maildev): an SMTP server on loopback that keeps every message in memory
// and shows it at http://127.0.0.1:<web port>/ (REST API under /api/email). `npm start` runs one on
// 1025/1080, `npm test` another on 2025/2080, so both can run at once.
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';

import { log } from './process.mjs';
import { root } from './paths.mjs';

async function answers(apiUrl) {
  try {
    const res = await fetch(`${apiUrl}/api/email`, { signal: AbortSignal.timeout(1000) });
    return res.ok;
  } catch {
    return false;
  }
}

/**
 * Starts maildev on 127.0.0.1 (unless one already answers on the web port, which is then reused).
 * Returns the SMTP settings, the API URL and `stop`, which stops only a catcher this call started.
 */
export async function startMailCatcher({ smtpPort, webPort }) {
  const apiUrl = `http://127.0.0.1:${webPort}`;
  const settings = { smtpHost: '127.0.0.1', smtpPort, apiUrl };
  if (await answers(apiUrl)) {
    log(`mail catcher already running: reading mail at ${apiUrl}/`);
    return { ...settings, stop: async () => {} };
  }
  const pkg = JSON.parse(readFileSync(join(root, 'node_modules', 'maildev', 'package.json'), 'utf8'));
  const bin = join(root, 'node_modules', 'maildev', typeof pkg.bin === 'string' ? pkg.bin : pkg.bin.maildev);
  const args = [bin, '--smtp', String(smtpPort), '--web', String(webPort), '--ip', '127.0.0.1', '--web-ip', '127.0.0.1', '--max-emails', '2000'];
  const child = spawn(process.execPath, args, { cwd: root, stdio: ['ignore', 'ignore', 'inherit'] });
  let exited = false;
  child.on('exit', () => {
    exited = true;
  });
  for (let i = 0; i < 100 && !(await answers(apiUrl)); i++) {
    if (exited) throw new Error(`the mail catcher did not start (are ports ${smtpPort}/${webPort} taken?)`);
    await sleep(100);
  }
  if (!(await answers(apiUrl))) throw new Error(`the mail catcher did not answer on ${apiUrl}`);
  log(`mail catcher on smtp://127.0.0.1:${smtpPort}; read caught mail at ${apiUrl}/`);
  return {
    ...settings,
    stop: async () => {
      if (exited) return;
      const done = new Promise((resolve) => child.once('exit', resolve));
      child.kill('SIGTERM');
      await Promise.race([done, sleep(3000)]);
    },
  };
}
