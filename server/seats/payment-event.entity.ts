import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';

import { SeatOrder } from './seat-order.entity';

export const PAYMENT_EVENT_OUTCOMES = ['applied', 'ignored', 'failed'] as const;
export type PaymentEventOutcome = (typeof PAYMENT_EVENT_OUTCOMES)[number];

/** A provider event, once: its id is the key, so a second delivery finds it and changes nothing. */
@Entity({ name: 'payment_event' })
@Index('payment_event_received_idx', ['receivedAt'])
export class PaymentEvent {
  @PrimaryColumn({ name: 'id', type: 'varchar', length: 255 })
  id!: string;

  @Column({ name: 'type', type: 'varchar', length: 100 })
  type!: string;

  @Column({ name: 'outcome', type: 'enum', enum: PAYMENT_EVENT_OUTCOMES, enumName: 'payment_event_outcome' })
  outcome!: PaymentEventOutcome;

  @Column({ name: 'reason', type: 'text', nullable: true })
  reason!: string | null;

  @Column({ name: 'order_id', type: 'uuid', nullable: true })
  orderId!: string | null;

  @ManyToOne(() => SeatOrder, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'order_id', foreignKeyConstraintName: 'payment_event_order_fkey' })
  order?: SeatOrder | null;

  /** How many times the provider delivered it (a duplicate adds one and is otherwise ignored). */
  @Column({ name: 'deliveries', type: 'integer', default: 1 })
  deliveries!: number;

  @Column({ name: 'received_at', type: 'timestamptz', default: () => 'now()' })
  receivedAt!: Date;

  @Column({ name: 'last_received_at', type: 'timestamptz', default: () => 'now()' })
  lastReceivedAt!: Date;
}
