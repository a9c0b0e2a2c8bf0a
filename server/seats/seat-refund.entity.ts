import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';

import { User } from '../accounts/user.entity';
import { SeatOrder } from './seat-order.entity';

export const SEAT_REFUND_STATUSES = ['pending', 'succeeded', 'failed'] as const;
export type SeatRefundStatus = (typeof SEAT_REFUND_STATUSES)[number];

/** A refund of unused seats of one order; the seats are reserved when asked for, settled by the provider's event. */
@Entity({ name: 'seat_refund' })
@Index('seat_refund_provider_key', ['providerRefundId'], { unique: true })
@Index('seat_refund_order_idx', ['orderId'])
@Check('seat_refund_amount_check', 'quantity > 0 AND amount > 0')
export class SeatRefund {
  @PrimaryGeneratedColumn('uuid', { name: 'id' })
  id!: string;

  @Column({ name: 'order_id', type: 'uuid' })
  orderId!: string;

  @ManyToOne(() => SeatOrder, { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'order_id', foreignKeyConstraintName: 'seat_refund_order_fkey' })
  order?: SeatOrder;

  @Column({ name: 'quantity', type: 'integer' })
  quantity!: number;

  @Column({ name: 'amount', type: 'integer' })
  amount!: number;

  @Column({ name: 'status', type: 'enum', enum: SEAT_REFUND_STATUSES, enumName: 'seat_refund_status', default: 'pending' })
  status!: SeatRefundStatus;

  @Column({ name: 'provider_refund_id', type: 'varchar', length: 255, nullable: true })
  providerRefundId!: string | null;

  @Column({ name: 'requested_by', type: 'uuid', nullable: true })
  requestedBy!: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'requested_by', foreignKeyConstraintName: 'seat_refund_requester_fkey' })
  requester?: User | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz', default: () => 'now()' })
  createdAt!: Date;

  @Column({ name: 'settled_at', type: 'timestamptz', nullable: true })
  settledAt!: Date | null;
}
