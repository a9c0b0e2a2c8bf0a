import { createHmac } from 'node:crypto';

import { compare, hash } from 'bcryptjs';

import commonPasswords from './common-passwords.json';

/**
 * bcrypt reads only the first 72 bytes of its input, so a long passphrase would be cut silently
 * (two passphrases sharing their first 72 bytes would both be accepted). We first reduce the
 * password to a fixed 44-byte value — HMAC-SHA-256 under a constant, versioned key, base64 — and
 * bcrypt that. Every byte of the passphrase counts, the input has no NUL bytes, and the constant key
 * keeps these values from matching unsalted SHA-256 hashes leaked elsewhere ("hash shucking").
 */
const PREHASH_KEY = 'flowlore:password-prehash:v1';

export function prehash(password: string): string {
  return createHmac('sha256', PREHASH_KEY).update(password.normalize('NFC'), 'utf8').digest('base64');
}

export class PasswordHasher {
  /** A valid hash of nothing anyone knows, compared against when no user matches (equal timing). */
  private decoy?: Promise<string>;

  constructor(readonly cost: number) {}

  hash(password: string): Promise<string> {
    return hash(prehash(password), this.cost);
  }

  verify(password: string, passwordHash: string): Promise<boolean> {
    return compare(prehash(password), passwordHash);
  }

  /** Spends the time a real check would, so an unknown e-mail answers no faster than a known one. */
  async spendEquivalentTime(password: string): Promise<void> {
    this.decoy ??= this.hash(`decoy:${Date.now()}:${Math.random()}`);
    await compare(prehash(password), await this.decoy);
  }
}

const common = new Set<string>(commonPasswords as string[]);

/**
 * Checks a new password beyond its length (the request schema checks 8–1000 characters): no
 * composition rules, but not one of the commonly used passwords we ship in common-passwords.json
 * (generated from the well-known lists' patterns: top choices, words with digits and years,
 * keyboard walks, repeats), and not the account's own e-mail address or name.
 */
export function passwordProblem(password: string, account: { email: string; displayName?: string }): string | undefined {
  const lowered = password.toLowerCase();
  if (common.has(lowered) || common.has(lowered.replace(/[\s!@#.]+$/, ''))) {
    return 'This password is one of the most commonly used ones. Choose another — a few unrelated words make a good one.';
  }
  const local = account.email.split('@')[0] ?? '';
  if (lowered === account.email.toLowerCase() || (local.length >= 4 && lowered === local.toLowerCase())) {
    return 'Do not use your e-mail address as the password.';
  }
  if (account.displayName && lowered.replace(/\s+/g, '') === account.displayName.toLowerCase().replace(/\s+/g, '')) {
    return 'Do not use your name as the password.';
  }
  return undefined;
}
