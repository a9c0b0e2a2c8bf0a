import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';

import { User } from '../accounts/user.entity';

export const ATTEMPT_STATUSES = ['open', 'submitted'] as const;
export type AttemptStatus = (typeof ATTEMPT_STATUSES)[number];

/**
 * One go at a quiz. `number` is 1, 2, 3 … per apprentice and quiz, unique, so the attempt limit
 * holds even under concurrent starts. Score columns are set when it is graded (submit or deadline).
 */
@Entity({ name: 'quiz_attempt' })
@Index('quiz_attempt_number_key', ['userId', 'quizSlug', 'number'], { unique: true })
export class QuizAttempt {
  @PrimaryGeneratedColumn('uuid', { name: 'id' })
  id!: string;

  @Column({ name: 'user_id', type: 'uuid' })
  userId!: string;

  @ManyToOne(() => User, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'quiz_attempt_user_fkey' })
  user?: User;

  @Column({ name: 'quiz_slug', type: 'varchar', length: 80 })
  quizSlug!: string;

  @Column({ name: 'number', type: 'integer' })
  number!: number;

  /** The attempt's seed; each question's seed derives from it (`questionSeed`). */
  @Column({ name: 'seed', type: 'integer' })
  seed!: number;

  @Column({ name: 'status', type: 'enum', enum: ATTEMPT_STATUSES, enumName: 'quiz_attempt_status', default: 'open' })
  status!: AttemptStatus;

  /** Bumped by every autosave: a submit grades the answers only if none changed after it read them. */
  @Column({ name: 'answers_version', type: 'integer', default: 0 })
  answersVersion!: number;

  /** The quiz's pass mark (percent) when the attempt started. */
  @Column({ name: 'pass_mark', type: 'double precision' })
  passMark!: number;

  @Column({ name: 'started_at', type: 'timestamptz' })
  startedAt!: Date;

  @Column({ name: 'deadline_at', type: 'timestamptz', nullable: true })
  deadlineAt!: Date | null;

  @Column({ name: 'submitted_at', type: 'timestamptz', nullable: true })
  submittedAt!: Date | null;

  @Column({ name: 'points', type: 'double precision', nullable: true })
  points!: number | null;

  @Column({ name: 'max_points', type: 'double precision' })
  maxPoints!: number;

  @Column({ name: 'score_percent', type: 'double precision', nullable: true })
  scorePercent!: number | null;

  @Column({ name: 'passed', type: 'boolean', nullable: true })
  passed!: boolean | null;

  /** Written answers still waiting for an instructor. */
  @Column({ name: 'pending_count', type: 'integer', default: 0 })
  pendingCount!: number;
}
