import type { DataSource } from 'typeorm';

import type { AdminUserChange, AdminUserQuery, AuditView, OutboxEntry, Page, UserSummary } from '../../shared/api/accounts';
import { toUserSummary } from '../accounts/account-view';
import { User } from '../accounts/user.entity';
import { endSessionsOf } from '../auth/session-revocation';
import { HttpProblem } from '../http/problem';
import { OutboxMessage } from '../mail/outbox-message.entity';
import { AuditEntry } from './audit-entry.entity';
import { recordAudit } from './audit-log';

const SORT_COLUMNS = { email: 'u.email', displayName: 'u.displayName', createdAt: 'u.createdAt', role: 'u.role' } as const;

/** What administrators see and change: users and roles, the e-mail outbox, the audit log. */
export class AdminService {
  constructor(private readonly dataSource: DataSource, private readonly now: () => Date) {}

  async listUsers(query: AdminUserQuery): Promise<Page<UserSummary>> {
    const qb = this.dataSource.getRepository(User).createQueryBuilder('u');
    if (query.role) qb.andWhere('u.role = :role', { role: query.role });
    if (query.q) {
      const like = `%${query.q.toLowerCase().replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
      qb.andWhere('(lower(u.email) LIKE :like OR lower(u.displayName) LIKE :like)', { like });
    }
    qb.orderBy(SORT_COLUMNS[query.sort], query.order === 'asc' ? 'ASC' : 'DESC').addOrderBy('u.id', 'ASC');
    qb.skip((query.page - 1) * query.pageSize).take(query.pageSize);
    const [users, total] = await qb.getManyAndCount();
    return { items: users.map(toUserSummary), page: query.page, pageSize: query.pageSize, total };
  }

  /** Changes a role and/or disables or enables an account, audited; disabling ends its sessions at once. */
  async changeUser(actorId: string, targetId: string, change: AdminUserChange): Promise<UserSummary> {
    return this.dataSource.transaction(async (manager) => {
      const user = await manager.getRepository(User).createQueryBuilder('u').setLock('pessimistic_write').where('u.id = :id', { id: targetId }).getOne();
      if (!user) throw HttpProblem.notFound(`There is no user "${targetId}".`);
      if (actorId === targetId && (change.disabled === true || (change.role && change.role !== 'admin'))) {
        throw HttpProblem.conflict('You cannot disable your own account or give up your own admin role.');
      }
      if (change.role && change.role !== user.role) {
        await manager.update(User, { id: user.id }, { role: change.role });
        await recordAudit(manager, { actorId, targetId, action: 'role.changed', detail: { from: user.role, to: change.role } });
        user.role = change.role;
      }
      const disabled = user.disabledAt !== null;
      if (change.disabled !== undefined && change.disabled !== disabled) {
        const disabledAt = change.disabled ? this.now() : null;
        await manager.update(User, { id: user.id }, { disabledAt });
        await recordAudit(manager, { actorId, targetId, action: change.disabled ? 'account.disabled' : 'account.enabled' });
        if (change.disabled) await endSessionsOf(manager, user.id);
        user.disabledAt = disabledAt;
      }
      return toUserSummary(user);
    });
  }

  async listOutbox(page: number, pageSize: number): Promise<Page<OutboxEntry>> {
    const [rows, total] = await this.dataSource.getRepository(OutboxMessage).findAndCount({
      order: { createdAt: 'DESC', id: 'ASC' },
      skip: (page - 1) * pageSize,
      take: pageSize,
    });
    const items = rows.map((m) => ({
      id: m.id,
      to: m.toAddress,
      subject: m.subject,
      template: m.template,
      status: m.status,
      error: m.error,
      sentAt: m.sentAt?.toISOString() ?? null,
      createdAt: m.createdAt.toISOString(),
      userId: m.userId,
      text: m.textBody,
    }));
    return { items, page, pageSize, total };
  }

  async listAudit(page: number, pageSize: number): Promise<Page<AuditView>> {
    const [rows, total] = await this.dataSource
      .getRepository(AuditEntry)
      .findAndCount({ relations: { actor: true, target: true }, order: { at: 'DESC', id: 'ASC' }, skip: (page - 1) * pageSize, take: pageSize });
    const person = (user: AuditEntry['actor']) => (user ? { id: user.id, displayName: user.displayName, email: user.email } : null);
    const items = rows.map((a) => ({
      id: a.id,
      actorId: a.actorId,
      targetId: a.targetId,
      actor: person(a.actor),
      target: person(a.target),
      action: a.action,
      detail: a.detail,
      at: a.at.toISOString(),
    }));
    return { items, page, pageSize, total };
  }
}
