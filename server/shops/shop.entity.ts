import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';

import type { User } from '../accounts/user.entity';

/** A shop owner's organisation; its apprentices point at it through `user_account.shop_id`. */
@Entity({ name: 'shop' })
@Index('shop_owner_key', ['ownerId'], { unique: true })
export class Shop {
  @PrimaryGeneratedColumn('uuid', { name: 'id' })
  id!: string;

  @Column({ name: 'name', type: 'varchar', length: 120 })
  name!: string;

  @Column({ name: 'owner_id', type: 'uuid' })
  ownerId!: string;

  @ManyToOne('User', { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'owner_id', foreignKeyConstraintName: 'shop_owner_fkey' })
  owner?: User;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz', default: () => 'now()' })
  createdAt!: Date;
}
