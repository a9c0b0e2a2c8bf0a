import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';

import { User } from '../accounts/user.entity';

/** One change to an account or a role: who did it, to whom, what, when. */
@Entity({ name: 'audit_entry' })
@Index('audit_entry_at_idx', ['at'])
export class AuditEntry {
  @PrimaryGeneratedColumn('uuid', { name: 'id' })
  id!: string;

  /** Null when the system acted (a seed) or the actor's account was deleted. */
  @Column({ name: 'actor_id', type: 'uuid', nullable: true })
  actorId!: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'actor_id', foreignKeyConstraintName: 'audit_entry_actor_fkey' })
  actor?: User | null;

  @Column({ name: 'target_id', type: 'uuid', nullable: true })
  targetId!: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'target_id', foreignKeyConstraintName: 'audit_entry_target_fkey' })
  target?: User | null;

  @Column({ name: 'action', type: 'varchar', length: 60 })
  action!: string;

  @Column({ name: 'detail', type: 'jsonb', default: () => "'{}'" })
  detail!: Record<string, unknown>;

  @Column({ name: 'at', type: 'timestamptz', default: () => 'now()' })
  at!: Date;
}
