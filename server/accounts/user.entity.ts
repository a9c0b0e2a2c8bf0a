import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';

import { ROLES, UNIT_SYSTEMS, type Role, type UnitSystem } from '../../shared/api/accounts';
import { Shop } from '../shops/shop.entity';

/**
 * A person who signs in. E-mail addresses are stored lower-cased and unique case-insensitively
 * (a unique index on lower(email), made by the migration). Never serialised as is: the API shapes
 * users through `toAccount`/`toUserSummary`, so the hash never leaves the server.
 */
@Entity({ name: 'user_account' })
@Index('user_account_email_key', { synchronize: false })
@Index('user_account_shop_idx', ['shopId'])
export class User {
  @PrimaryGeneratedColumn('uuid', { name: 'id' })
  id!: string;

  @Column({ name: 'email', type: 'varchar', length: 254 })
  email!: string;

  @Column({ name: 'display_name', type: 'varchar', length: 100 })
  displayName!: string;

  /** bcrypt of a pre-hashed password (see server/auth/passwords.ts). */
  @Column({ name: 'password_hash', type: 'varchar', length: 100 })
  passwordHash!: string;

  @Column({ name: 'role', type: 'enum', enum: ROLES, enumName: 'user_role' })
  role!: Role;

  /** The shop an apprentice belongs to (at most one), or the shop a shop owner runs. */
  @Column({ name: 'shop_id', type: 'uuid', nullable: true })
  shopId!: string | null;

  @ManyToOne(() => Shop, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'shop_id', foreignKeyConstraintName: 'user_account_shop_fkey' })
  shop?: Shop | null;

  @Column({ name: 'verified_at', type: 'timestamptz', nullable: true })
  verifiedAt!: Date | null;

  @Column({ name: 'disabled_at', type: 'timestamptz', nullable: true })
  disabledAt!: Date | null;

  /** Failed sign-ins since the last success; drives the growing per-account delay. */
  @Column({ name: 'failed_sign_ins', type: 'integer', default: 0 })
  failedSignIns!: number;

  @Column({ name: 'last_failed_sign_in_at', type: 'timestamptz', nullable: true })
  lastFailedSignInAt!: Date | null;

  /** The calculators' units, saved on the user's first US/SI switch; null until then. */
  @Column({ name: 'unit_system', type: 'enum', enum: UNIT_SYSTEMS, enumName: 'unit_system', nullable: true })
  unitSystem!: UnitSystem | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz', default: () => 'now()' })
  createdAt!: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz', default: () => 'now()' })
  updatedAt!: Date;
}
