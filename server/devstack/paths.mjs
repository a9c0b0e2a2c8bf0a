// Where the local stack keeps its files: everything under the checkout's git-ignored .data/.
import { existsSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

export const root = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');
export const dataDir = join(root, '.data');

/** Reads `.env` from the checkout if there is one (values already in the environment win). */
export function loadDotEnv() {
  const file = join(root, '.env');
  if (existsSync(file)) process.loadEnvFile(file);
}
