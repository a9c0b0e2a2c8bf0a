import { execFileSync } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { join, resolve } from 'node:path';

import type { Role } from '../shared/api/accounts';

/** The repository root: where the built CLI runs, as an operator would run it. */
const root = resolve(__dirname, '..');

/** The signed-in state the setup project saves for each role (git-ignored). */
export function authFile(role: Exclude<Role, 'apprentice'>): string {
  return join(__dirname, '.auth', `${role.replace('_', '-')}.json`);
}

/** The password of every account the browser tests create through the CLI (not a common one). */
export const E2E_PASSWORD = 'e2e bench passphrase for roles';

export interface CreatedUser {
  readonly id: string;
  readonly email: string;
  readonly displayName: string;
}

/**
 * Creates a verified account with the built `cli.js create-user`, against the database the e2e server
 * uses; the password goes in the environment, never on the command line. A fresh address each call.
 */
export function createUserByCli(role: Role, options: { displayName?: string; shop?: string } = {}): CreatedUser {
  const tag = randomUUID().slice(0, 8);
  const email = `e2e-${role.replace('_', '-')}-${tag}@example.test`;
  const displayName = options.displayName ?? `E2E ${role.replace('_', ' ')} ${tag}`;
  const args = ['dist/api/server/cli.js', 'create-user', '--email', email, '--name', displayName, '--role', role];
  if (options.shop) args.push('--shop', options.shop);
  const stdout = execFileSync('node', args, {
    cwd: root,
    // Test accounts get a fast hash (bcrypt cost 4, as in the server tests; allowed only with
    // NODE_ENV=test): at the production cost each account took seconds of a browser test's time.
    // Hashing at the real cost is tested in server/auth.
    env: { ...process.env, DATABASE_URL: process.env['DATABASE_URL'] ?? '', FLOWLORE_NEW_USER_PASSWORD: E2E_PASSWORD, LOG_LEVEL: 'warn', NODE_ENV: 'test', PASSWORD_HASH_COST: '4' },
    encoding: 'utf8',
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  return { id: stdout.trim(), email, displayName };
}
