// Installs the npm packages with `npm ci` when node_modules is missing or older than the lock file.
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

import { log, run } from './process.mjs';

export async function ensureNpmDependencies(root) {
  const lockHash = createHash('sha256').update(readFileSync(join(root, 'package-lock.json'))).digest('hex');
  const stamp = join(root, 'node_modules', '.flowlore-lock-hash');
  if (existsSync(stamp) && readFileSync(stamp, 'utf8').trim() === lockHash) return;
  log('installing npm packages (npm ci)');
  // Browsers are never downloaded: the tests drive Debian's Chromium.
  const env = { ...process.env, PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: '1' };
  await run('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root, env });
  writeFileSync(stamp, `${lockHash}\n`);
}
