import { CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';

import { User } from '../accounts/user.entity';
import { Cohort } from './cohort.entity';

/** An apprentice in a cohort. */
@Entity({ name: 'cohort_member' })
@Index('cohort_member_user_idx', ['userId'])
export class CohortMember {
  @PrimaryColumn({ name: 'cohort_id', type: 'uuid' })
  cohortId!: string;

  @PrimaryColumn({ name: 'user_id', type: 'uuid' })
  userId!: string;

  @ManyToOne(() => Cohort, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'cohort_id', foreignKeyConstraintName: 'cohort_member_cohort_fkey' })
  cohort?: Cohort;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'cohort_member_user_fkey' })
  user?: User;

  @CreateDateColumn({ name: 'added_at', type: 'timestamptz', default: () => 'now()' })
  addedAt!: Date;
}
