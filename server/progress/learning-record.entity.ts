import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';

import { User } from '../accounts/user.entity';
import { QuizAttempt } from '../quizzes/quiz-attempt.entity';

/** One xAPI statement (JSON as the spec shapes it), made when an attempt is graded. */
@Entity({ name: 'learning_record' })
@Index('learning_record_user_idx', ['userId', 'storedAt'])
@Index('learning_record_attempt_idx', ['attemptId'])
export class LearningRecord {
  @PrimaryGeneratedColumn('uuid', { name: 'id' })
  id!: string;

  @Column({ name: 'user_id', type: 'uuid' })
  userId!: string;

  @ManyToOne(() => User, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'learning_record_user_fkey' })
  user?: User;

  @Column({ name: 'attempt_id', type: 'uuid', nullable: true })
  attemptId!: string | null;

  @ManyToOne(() => QuizAttempt, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'attempt_id', foreignKeyConstraintName: 'learning_record_attempt_fkey' })
  attempt?: QuizAttempt | null;

  /** The verb's last word: attempted, answered, passed, failed, completed. */
  @Column({ name: 'verb', type: 'varchar', length: 40 })
  verb!: string;

  @Column({ name: 'statement', type: 'jsonb' })
  statement!: Record<string, unknown>;

  @Column({ name: 'stored_at', type: 'timestamptz', default: () => 'now()' })
  storedAt!: Date;
}
