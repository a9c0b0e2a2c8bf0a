import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';

import { User } from '../accounts/user.entity';
import { Shop } from '../shops/shop.entity';

/**
 * The seats of a shop, or of one individual learner who bought their own (migration 1796800000000).
 * `inUse` is kept by the trigger on `seat`; the balance CHECK refuses more seats in use or refunded
 * than were purchased, whatever the code does.
 */
@Entity({ name: 'seat_pool' })
@Index('seat_pool_shop_key', ['shopId'], { unique: true })
@Index('seat_pool_learner_key', ['learnerId'], { unique: true })
@Check('seat_pool_owner_check', '(shop_id IS NULL) <> (learner_id IS NULL)')
@Check('seat_pool_balance_check', 'purchased >= 0 AND refunded >= 0 AND in_use >= 0 AND in_use + refunded <= purchased')
export class SeatPool {
  @PrimaryGeneratedColumn('uuid', { name: 'id' })
  id!: string;

  @Column({ name: 'shop_id', type: 'uuid', nullable: true })
  shopId!: string | null;

  @ManyToOne(() => Shop, { onDelete: 'RESTRICT', nullable: true })
  @JoinColumn({ name: 'shop_id', foreignKeyConstraintName: 'seat_pool_shop_fkey' })
  shop?: Shop | null;

  @Column({ name: 'learner_id', type: 'uuid', nullable: true })
  learnerId!: string | null;

  @ManyToOne(() => User, { onDelete: 'RESTRICT', nullable: true })
  @JoinColumn({ name: 'learner_id', foreignKeyConstraintName: 'seat_pool_learner_fkey' })
  learner?: User | null;

  @Column({ name: 'purchased', type: 'integer', default: 0 })
  purchased!: number;

  @Column({ name: 'refunded', type: 'integer', default: 0 })
  refunded!: number;

  /** Held by an invitation or assigned; kept by the database. */
  @Column({ name: 'in_use', type: 'integer', default: 0 })
  inUse!: number;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz', default: () => 'now()' })
  createdAt!: Date;
}
