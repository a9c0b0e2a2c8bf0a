import type { EntityManager } from 'typeorm';

/**
 * Ends a user's sessions by deleting their rows in connect-pg-simple's table (the session is
 * gone for every app instance at once). `exceptSid` keeps the caller's own session.
 */
export async function endSessionsOf(manager: EntityManager, userId: string, exceptSid?: string): Promise<void> {
  await manager.query(
    `DELETE FROM session WHERE sess->'passport'->>'user' = $1 AND ($2::varchar IS NULL OR sid <> $2)`,
    [userId, exceptSid ?? null],
  );
}
