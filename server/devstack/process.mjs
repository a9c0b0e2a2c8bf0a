// Small process helpers for the local stack scripts. Node built-ins only: these run before
// `npm ci` may have installed anything.
import { spawn, spawnSync } from 'node:child_process';

export function log(message) {
  process.stdout.write(`[flowlore] ${message}\n`);
}

/** Runs a command to completion, inheriting stdio; rejects on a non-zero exit. */
export function run(command, args, options = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { stdio: 'inherit', ...options });
    child.on('error', reject);
    child.on('exit', (code, signal) => {
      if (code === 0) resolve();
      else reject(new Error(`${command} ${args.join(' ')} exited with ${signal ?? code}`));
    });
  });
}

/** Runs a command and returns its exit status and output, never throwing. */
export function capture(command, args, options = {}) {
  const result = spawnSync(command, args, { encoding: 'utf8', ...options });
  return { status: result.status ?? 1, stdout: result.stdout ?? '', stderr: result.stderr ?? '' };
}

export function isRoot() {
  return typeof process.getuid === 'function' && process.getuid() === 0;
}

/** Installs Debian packages with apt-get (as root), refreshing the package lists once first. */
let aptUpdated = false;
export async function aptInstall(packages) {
  if (!isRoot()) {
    throw new Error(`Please install the Debian package(s) ${packages.join(', ')} (apt-get install needs root).`);
  }
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  if (!aptUpdated) {
    log('apt-get update');
    await run('apt-get', ['update', '-qq'], { env });
    aptUpdated = true;
  }
  log(`apt-get install ${packages.join(' ')}`);
  await run('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...packages], { env });
}
