import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';

import { User } from '../accounts/user.entity';

/**
 * An apprentice's standing in one quiz, kept by triggers on `quiz_attempt` and `quiz_response`
 * (migration 1796400000000): the gradebook reads it instead of aggregating attempts. Read-only here.
 */
@Entity({ name: 'quiz_standing' })
// Made by migration 1796700000000 with NULLS FIRST and INCLUDE (user_id), which TypeORM cannot
// express: declared so it is known, left alone by schema comparison.
@Index('quiz_standing_quiz_idx', { synchronize: false })
export class QuizStanding {
  @PrimaryColumn({ name: 'user_id', type: 'uuid' })
  userId!: string;

  @PrimaryColumn({ name: 'quiz_slug', type: 'varchar', length: 80 })
  quizSlug!: string;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'quiz_standing_user_fkey' })
  user?: User;

  @Column({ name: 'status', type: 'varchar', length: 24, default: 'not-started' })
  status!: string;

  @Column({ name: 'best_percent', type: 'double precision', nullable: true })
  bestPercent!: number | null;

  @Column({ name: 'attempts_used', type: 'integer', default: 0 })
  attemptsUsed!: number;

  @Column({ name: 'failed_attempts', type: 'integer', default: 0 })
  failedAttempts!: number;

  @Column({ name: 'last_activity_at', type: 'timestamptz', nullable: true })
  lastActivityAt!: Date | null;
}

/** An apprentice's standing across the course, kept by triggers on `lesson_progress` and `quiz_standing`'s refresh. */
@Entity({ name: 'learner_standing' })
export class LearnerStanding {
  @PrimaryColumn({ name: 'user_id', type: 'uuid' })
  userId!: string;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'learner_standing_user_fkey' })
  user?: User;

  @Column({ name: 'lessons_finished', type: 'integer', default: 0 })
  lessonsFinished!: number;

  @Column({ name: 'quizzes_passed', type: 'integer', default: 0 })
  quizzesPassed!: number;

  @Column({ name: 'max_failed_attempts', type: 'integer', default: 0 })
  maxFailedAttempts!: number;

  @Column({ name: 'last_activity_at', type: 'timestamptz', nullable: true })
  lastActivityAt!: Date | null;
}
