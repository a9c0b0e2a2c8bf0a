import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';

import { User } from '../accounts/user.entity';

/** A group of apprentices taught together, owned by one instructor. */
@Entity({ name: 'cohort' })
@Index('cohort_instructor_idx', ['instructorId'])
export class Cohort {
  @PrimaryGeneratedColumn('uuid', { name: 'id' })
  id!: string;

  @Column({ name: 'name', type: 'varchar', length: 120 })
  name!: string;

  @Column({ name: 'instructor_id', type: 'uuid' })
  instructorId!: string;

  @ManyToOne(() => User, { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'instructor_id', foreignKeyConstraintName: 'cohort_instructor_fkey' })
  instructor?: User;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz', default: () => 'now()' })
  createdAt!: Date;
}
