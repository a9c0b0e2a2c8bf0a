import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';

import { User } from '../accounts/user.entity';
import { SeatPool } from './seat-pool.entity';

export const SEAT_STATUSES = ['invited', 'assigned', 'released'] as const;
export type SeatStatus = (typeof SEAT_STATUSES)[number];

/** One holding of a seat: invited (held for an address), assigned (to an apprentice), released. History stays. */
@Entity({ name: 'seat' })
@Index('seat_pool_idx', ['poolId', 'status'])
@Index('seat_holder_key', ['holderId'], { unique: true, where: `status = 'assigned'` })
@Check('seat_holder_check', `status <> 'assigned' OR holder_id IS NOT NULL`)
@Check('seat_invited_check', `status <> 'invited' OR invited_email IS NOT NULL`)
export class Seat {
  @PrimaryGeneratedColumn('uuid', { name: 'id' })
  id!: string;

  @Column({ name: 'pool_id', type: 'uuid' })
  poolId!: string;

  @ManyToOne(() => SeatPool, { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'pool_id', foreignKeyConstraintName: 'seat_pool_fkey' })
  pool?: SeatPool;

  @Column({ name: 'status', type: 'enum', enum: SEAT_STATUSES, enumName: 'seat_status' })
  status!: SeatStatus;

  @Column({ name: 'holder_id', type: 'uuid', nullable: true })
  holderId!: string | null;

  @ManyToOne(() => User, { onDelete: 'CASCADE', nullable: true })
  @JoinColumn({ name: 'holder_id', foreignKeyConstraintName: 'seat_holder_fkey' })
  holder?: User | null;

  @Column({ name: 'invited_email', type: 'varchar', length: 254, nullable: true })
  invitedEmail!: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz', default: () => 'now()' })
  createdAt!: Date;

  @Column({ name: 'assigned_at', type: 'timestamptz', nullable: true })
  assignedAt!: Date | null;

  @Column({ name: 'released_at', type: 'timestamptz', nullable: true })
  releasedAt!: Date | null;
}
