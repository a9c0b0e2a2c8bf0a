import { createHash, randomBytes } from 'node:crypto';

import type { EntityManager } from 'typeorm';

import { AccountToken, type TokenPurpose } from './account-token.entity';

export const TOKEN_LIFETIME_MS: Record<TokenPurpose, number> = {
  'verify-email': 48 * 3600_000,
  'reset-password': 3600_000,
  invitation: 7 * 24 * 3600_000,
};

export function tokenHash(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/**
 * Single-use e-mail tokens. The token (32 random bytes, base64url) goes into the link; the database
 * keeps only its SHA-256, so a leaked table opens nothing. Issuing a new one retires the user's
 * unused tokens of the same purpose.
 */
export async function issueToken(manager: EntityManager, userId: string, purpose: TokenPurpose, now: Date): Promise<string> {
  const token = randomBytes(32).toString('base64url');
  await manager.query(
    `UPDATE account_token SET used_at = $3 WHERE user_id = $1 AND purpose = $2 AND used_at IS NULL`,
    [userId, purpose, now],
  );
  await manager.insert(AccountToken, {
    userId,
    purpose,
    tokenHash: tokenHash(token),
    expiresAt: new Date(now.getTime() + TOKEN_LIFETIME_MS[purpose]),
    usedAt: null,
  });
  return token;
}

/** Marks the token used and returns its user, or undefined when it is unknown, used or expired. One statement: two racing uses cannot both win. */
export async function consumeToken(manager: EntityManager, token: string, purpose: TokenPurpose, now: Date): Promise<string | undefined> {
  const rows: Array<{ user_id: string }> = await manager.query(
    `UPDATE account_token SET used_at = $3
      WHERE token_hash = $1 AND purpose = $2 AND used_at IS NULL AND expires_at > $3
      RETURNING user_id`,
    [tokenHash(token), purpose, now],
  );
  // TypeORM returns [rows, count] for UPDATE … RETURNING on PostgreSQL.
  const returned = Array.isArray(rows[0]) ? (rows[0] as Array<{ user_id: string }>) : rows;
  return returned[0]?.user_id;
}
