import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';

import { User } from '../accounts/user.entity';
import { Seat } from './seat.entity';

/** An invitation holding one seat for an address; its link's token is kept only as a SHA-256. */
@Entity({ name: 'seat_invitation' })
@Index('seat_invitation_seat_key', ['seatId'], { unique: true })
@Index('seat_invitation_token_key', ['tokenHash'], { unique: true })
export class SeatInvitation {
  @PrimaryGeneratedColumn('uuid', { name: 'id' })
  id!: string;

  @Column({ name: 'seat_id', type: 'uuid' })
  seatId!: string;

  @ManyToOne(() => Seat, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'seat_id', foreignKeyConstraintName: 'seat_invitation_seat_fkey' })
  seat?: Seat;

  @Column({ name: 'email', type: 'varchar', length: 254 })
  email!: string;

  @Column({ name: 'token_hash', type: 'varchar', length: 64 })
  tokenHash!: string;

  @Column({ name: 'invited_by', type: 'uuid', nullable: true })
  invitedBy!: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'invited_by', foreignKeyConstraintName: 'seat_invitation_inviter_fkey' })
  inviter?: User | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz', default: () => 'now()' })
  createdAt!: Date;

  @Column({ name: 'expires_at', type: 'timestamptz' })
  expiresAt!: Date;

  @Column({ name: 'last_sent_at', type: 'timestamptz', default: () => 'now()' })
  lastSentAt!: Date;

  @Column({ name: 'send_count', type: 'integer', default: 1 })
  sendCount!: number;

  @Column({ name: 'accepted_at', type: 'timestamptz', nullable: true })
  acceptedAt!: Date | null;

  @Column({ name: 'accepted_by', type: 'uuid', nullable: true })
  acceptedBy!: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'accepted_by', foreignKeyConstraintName: 'seat_invitation_acceptor_fkey' })
  acceptor?: User | null;

  @Column({ name: 'revoked_at', type: 'timestamptz', nullable: true })
  revokedAt!: Date | null;
}
