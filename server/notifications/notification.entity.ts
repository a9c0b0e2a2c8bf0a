import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';

import type { NotificationKind } from '../../shared/api/notifications';
import { User } from '../accounts/user.entity';

/**
 * An in-app notification: what the bell in the top bar counts and the notifications page lists.
 * Written in the same transaction as the change it reports, so a grade never lands without it.
 */
@Entity({ name: 'notification' })
@Index('notification_user_idx', ['userId', 'createdAt'])
@Index('notification_unread_idx', ['userId'], { where: 'read_at IS NULL' })
@Check('notification_link_check', `link IS NULL OR link LIKE '/%'`)
export class Notification {
  @PrimaryGeneratedColumn('uuid', { name: 'id' })
  id!: string;

  @Column({ name: 'user_id', type: 'uuid' })
  userId!: string;

  @ManyToOne(() => User, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'notification_user_fkey' })
  user?: User;

  @Column({ name: 'kind', type: 'varchar', length: 40 })
  kind!: NotificationKind;

  @Column({ name: 'title', type: 'varchar', length: 200 })
  title!: string;

  @Column({ name: 'body', type: 'text' })
  body!: string;

  @Column({ name: 'link', type: 'varchar', length: 500, nullable: true })
  link!: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz', default: () => 'now()' })
  createdAt!: Date;

  @Column({ name: 'read_at', type: 'timestamptz', nullable: true })
  readAt!: Date | null;
}
