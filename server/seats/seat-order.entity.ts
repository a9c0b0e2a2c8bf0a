import { Check, Column, CreateDateColumn, Entity, Generated, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';

import { User } from '../accounts/user.entity';
import { SeatPool } from './seat-pool.entity';

export const SEAT_ORDER_STATUSES = ['pending', 'paid', 'expired', 'failed'] as const;
export type SeatOrderStatus = (typeof SEAT_ORDER_STATUSES)[number];

/** A purchase of seats: amounts in integer minor units, the checkout session, what became of it. */
@Entity({ name: 'seat_order' })
@Index('seat_order_number_key', ['number'], { unique: true })
@Index('seat_order_session_key', ['checkoutSessionId'], { unique: true })
@Index('seat_order_pool_idx', ['poolId', 'createdAt'])
@Check('seat_order_amount_check', 'quantity BETWEEN 1 AND 500 AND unit_amount > 0 AND total_amount = unit_amount * quantity')
export class SeatOrder {
  @PrimaryGeneratedColumn('uuid', { name: 'id' })
  id!: string;

  /** The order number people read on receipts (from 1001). bigint: read as text. */
  @Column({ name: 'number', type: 'bigint' })
  @Generated('increment')
  number!: string;

  @Column({ name: 'pool_id', type: 'uuid' })
  poolId!: string;

  @ManyToOne(() => SeatPool, { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'pool_id', foreignKeyConstraintName: 'seat_order_pool_fkey' })
  pool?: SeatPool;

  @Column({ name: 'buyer_id', type: 'uuid', nullable: true })
  buyerId!: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'buyer_id', foreignKeyConstraintName: 'seat_order_buyer_fkey' })
  buyer?: User | null;

  @Column({ name: 'quantity', type: 'integer' })
  quantity!: number;

  @Column({ name: 'unit_amount', type: 'integer' })
  unitAmount!: number;

  @Column({ name: 'total_amount', type: 'integer' })
  totalAmount!: number;

  @Column({ name: 'currency', type: 'varchar', length: 3 })
  currency!: string;

  @Column({ name: 'status', type: 'enum', enum: SEAT_ORDER_STATUSES, enumName: 'seat_order_status', default: 'pending' })
  status!: SeatOrderStatus;

  @Column({ name: 'checkout_session_id', type: 'varchar', length: 255, nullable: true })
  checkoutSessionId!: string | null;

  @Column({ name: 'payment_intent_id', type: 'varchar', length: 255, nullable: true })
  paymentIntentId!: string | null;

  @Column({ name: 'card_last4', type: 'varchar', length: 4, nullable: true })
  cardLast4!: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz', default: () => 'now()' })
  createdAt!: Date;

  @Column({ name: 'expires_at', type: 'timestamptz' })
  expiresAt!: Date;

  @Column({ name: 'paid_at', type: 'timestamptz', nullable: true })
  paidAt!: Date | null;
}
