// The local mail catcher (maildev): an SMTP server on loopback that keeps every message in memory
// and shows it at http://127.0.0.1:<web port>/ (REST API under /api/email). `npm start` asks for
// 1025/1080, `npm test` for 2025/2080, so both can run at once; when another checkout's catcher
// holds a port, the next free one is taken (and logged).
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';

import { freePort, isPortFree } from './ports.mjs';
import { log } from './process.mjs';
import { root } from './paths.mjs';

const HOLDER = 'another mail catcher';

async function answers(apiUrl) {
  try {
    const res = await fetch(`${apiUrl}/api/email`, { signal: AbortSignal.timeout(1000) });
    return res.ok;
  } catch {
    return false;
  }
}

function maildevBin() {
  const pkg = JSON.parse(readFileSync(join(root, 'node_modules', 'maildev', 'package.json'), 'utf8'));
  return join(root, 'node_modules', 'maildev', typeof pkg.bin === 'string' ? pkg.bin : pkg.bin.maildev);
}

/** Runs maildev on the two ports; resolves to the child once its API answers, or undefined if it exited first. */
async function launch(smtpPort, webPort) {
  const apiUrl = `http://127.0.0.1:${webPort}`;
  const args = [maildevBin(), '--smtp', String(smtpPort), '--web', String(webPort), '--ip', '127.0.0.1', '--web-ip', '127.0.0.1', '--max-emails', '2000'];
  const child = spawn(process.execPath, args, { cwd: root, stdio: ['ignore', 'ignore', 'inherit'] });
  let exited = false;
  child.on('exit', () => {
    exited = true;
  });
  for (let i = 0; i < 100 && !exited; i++) {
    if (await answers(apiUrl)) return { child, exited: () => exited };
    await sleep(100);
  }
  if (exited) return undefined;
  child.kill('SIGTERM');
  throw new Error(`the mail catcher did not answer on ${apiUrl}`);
}

/**
 * Starts maildev of our own on 127.0.0.1, on the asked ports or the next free ones (a catcher of
 * another checkout is never borrowed: it could stop in the middle of our run). Returns the SMTP
 * settings, the API URL and `stop`.
 */
export async function startMailCatcher({ smtpPort: wantedSmtp, webPort: wantedWeb }) {
  let smtpPort = await freePort(wantedSmtp, { holder: HOLDER });
  let webPort = await freePort(wantedWeb, { holder: HOLDER, avoid: [smtpPort] });
  let started;
  for (let attempt = 1; !started; attempt++) {
    started = await launch(smtpPort, webPort);
    if (started) break;
    // It exited at once: most likely a port was taken between the probe and its start.
    if (attempt === 3 || ((await isPortFree(smtpPort)) && (await isPortFree(webPort)))) {
      throw new Error(`the mail catcher did not start on ports ${smtpPort}/${webPort}`);
    }
    log(`ports ${smtpPort}/${webPort} were taken while the mail catcher started; trying the next free ones`);
    smtpPort = await freePort(smtpPort + 1, { avoid: [webPort] });
    webPort = await freePort(webPort + 1, { avoid: [smtpPort] });
  }
  const apiUrl = `http://127.0.0.1:${webPort}`;
  log(`mail catcher on smtp://127.0.0.1:${smtpPort}; read caught mail at ${apiUrl}/`);
  return {
    smtpHost: '127.0.0.1',
    smtpPort,
    apiUrl,
    stop: async () => {
      if (started.exited()) return;
      const done = new Promise((resolve) => started.child.once('exit', resolve));
      started.child.kill('SIGTERM');
      await Promise.race([done, sleep(3000)]);
    },
  };
}
