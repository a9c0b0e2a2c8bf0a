import type { EntityManager } from 'typeorm';

import { AuditEntry } from './audit-entry.entity';

/** Records one change to an account (role, disabled, …) in the same transaction as the change. */
export async function recordAudit(
  manager: EntityManager,
  entry: { actorId: string | null; targetId: string | null; action: string; detail?: Record<string, unknown> },
): Promise<void> {
  const row = manager.create(AuditEntry, { actorId: entry.actorId, targetId: entry.targetId, action: entry.action, detail: entry.detail ?? {} });
  await manager.save(row);
}
