import type { DataSource, EntityManager } from 'typeorm';

import type { MarkReadRequest, NotificationKind, NotificationsPage, NotificationsQuery, NotificationView } from '../../shared/api/notifications';
import type { User } from '../accounts/user.entity';
import { Notification } from './notification.entity';

export interface NewNotification {
  readonly userId: string;
  readonly kind: NotificationKind;
  readonly title: string;
  readonly body: string;
  /** An app path ("/course/…"), not a full address. */
  readonly link?: string | null;
}

/**
 * Writes a notification inside the caller's transaction, so it lands with the change it reports
 * (or not at all). E-mail goes out separately, through the mailer, once the change is committed.
 */
export async function notify(manager: EntityManager, notice: NewNotification): Promise<void> {
  if (notice.link && !notice.link.startsWith('/')) throw new Error(`A notification links inside the app: "${notice.link}"`);
  await manager.insert(Notification, {
    userId: notice.userId,
    kind: notice.kind,
    title: notice.title.slice(0, 200),
    body: notice.body,
    link: notice.link ?? null,
  });
}

/** A user's own notifications: the list, the unread count, marking read. Nobody reads another's. */
export class NotificationsService {
  constructor(private readonly dataSource: DataSource) {}

  async list(user: User, query: NotificationsQuery): Promise<NotificationsPage> {
    const builder = this.dataSource
      .getRepository(Notification)
      .createQueryBuilder('n')
      .where('n.user_id = :userId', { userId: user.id })
      .orderBy('n.created_at', 'DESC')
      .addOrderBy('n.id', 'DESC')
      .limit(query.limit);
    if (query.unread === 'true') builder.andWhere('n.read_at IS NULL');
    if (query.unread === 'false') builder.andWhere('n.read_at IS NOT NULL');
    const [rows, unread] = await Promise.all([builder.getMany(), this.unreadCount(user.id)]);
    return { items: rows.map(view), unread };
  }

  async markRead(user: User, request: MarkReadRequest): Promise<{ unread: number }> {
    const update = this.dataSource
      .createQueryBuilder()
      .update(Notification)
      .set({ readAt: () => 'now()' })
      .where('user_id = :userId AND read_at IS NULL', { userId: user.id });
    // Someone else's id is simply not found among one's own: nothing changes, nothing is told.
    if ('ids' in request) update.andWhere('id IN (:...ids)', { ids: request.ids });
    await update.execute();
    return { unread: await this.unreadCount(user.id) };
  }

  private async unreadCount(userId: string): Promise<number> {
    const [{ count }] = await this.dataSource.query('SELECT count(*)::int AS count FROM notification WHERE user_id = $1 AND read_at IS NULL', [userId]);
    return count as number;
  }
}

function view(row: Notification): NotificationView {
  return {
    id: row.id,
    kind: row.kind,
    title: row.title,
    body: row.body,
    link: row.link,
    createdAt: row.createdAt.toISOString(),
    readAt: row.readAt?.toISOString() ?? null,
  };
}
