import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';

import { User } from '../accounts/user.entity';

export const OUTBOX_STATUSES = ['sent', 'failed'] as const;
export type OutboxStatus = (typeof OUTBOX_STATUSES)[number];

/**
 * Every e-mail the app tried to send, sent or not. Secret links (tokens) are replaced by
 * "[link removed]" before the record is written, so the log can be shown to admins.
 */
@Entity({ name: 'mail_outbox' })
@Index('mail_outbox_created_idx', ['createdAt'])
@Index('mail_outbox_user_idx', ['userId'])
export class OutboxMessage {
  @PrimaryGeneratedColumn('uuid', { name: 'id' })
  id!: string;

  @Column({ name: 'to_address', type: 'varchar', length: 254 })
  toAddress!: string;

  @Column({ name: 'subject', type: 'varchar', length: 200 })
  subject!: string;

  @Column({ name: 'template', type: 'varchar', length: 60 })
  template!: string;

  @Column({ name: 'text_body', type: 'text' })
  textBody!: string;

  @Column({ name: 'html_body', type: 'text' })
  htmlBody!: string;

  @Column({ name: 'status', type: 'enum', enum: OUTBOX_STATUSES, enumName: 'mail_status' })
  status!: OutboxStatus;

  @Column({ name: 'error', type: 'text', nullable: true })
  error!: string | null;

  @Column({ name: 'sent_at', type: 'timestamptz', nullable: true })
  sentAt!: Date | null;

  @Column({ name: 'user_id', type: 'uuid', nullable: true })
  userId!: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'mail_outbox_user_fkey' })
  user?: User | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz', default: () => 'now()' })
  createdAt!: Date;
}
