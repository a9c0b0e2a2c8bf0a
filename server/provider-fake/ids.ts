import { randomBytes } from 'node:crypto';

const ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';

/** An id shaped like the provider's (`cs_test_…`, `pi_…`, `evt_…`): the prefix, then 24 random letters and digits. */
export function newId(prefix: string, length = 24): string {
  let id = '';
  while (id.length < length) {
    // 248 is the largest multiple of 62 below 256: dropping bytes above it keeps every character equally likely.
    for (const byte of randomBytes(length)) if (byte < 248 && id.length < length) id += ALPHABET[byte % ALPHABET.length];
  }
  return `${prefix}_${id}`;
}
