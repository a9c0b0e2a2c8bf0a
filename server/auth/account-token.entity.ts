import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';

import { User } from '../accounts/user.entity';

export const TOKEN_PURPOSES = ['verify-email', 'reset-password', 'invitation'] as const;
export type TokenPurpose = (typeof TOKEN_PURPOSES)[number];

/** A single-use token sent by e-mail. Only its SHA-256 is stored; the token itself lives in the link. */
@Entity({ name: 'account_token' })
@Index('account_token_hash_key', ['tokenHash'], { unique: true })
@Index('account_token_user_idx', ['userId'])
export class AccountToken {
  @PrimaryGeneratedColumn('uuid', { name: 'id' })
  id!: string;

  @Column({ name: 'user_id', type: 'uuid' })
  userId!: string;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'account_token_user_fkey' })
  user?: User;

  @Column({ name: 'purpose', type: 'enum', enum: TOKEN_PURPOSES, enumName: 'account_token_purpose' })
  purpose!: TokenPurpose;

  /** Hex SHA-256 of the token. */
  @Column({ name: 'token_hash', type: 'varchar', length: 64 })
  tokenHash!: string;

  @Column({ name: 'expires_at', type: 'timestamptz' })
  expiresAt!: Date;

  @Column({ name: 'used_at', type: 'timestamptz', nullable: true })
  usedAt!: Date | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz', default: () => 'now()' })
  createdAt!: Date;
}
