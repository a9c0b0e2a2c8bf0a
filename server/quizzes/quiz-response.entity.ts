import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';

import type { Step } from '../../shared/airflow';
import type { ResponseValue } from '../../shared/quiz/answers';
import type { Quantity } from '../../shared/quiz/definition';
import { User } from '../accounts/user.entity';
import { QuestionVersion } from './question-version.entity';
import { QuizAttempt } from './quiz-attempt.entity';

export const RESPONSE_STATUSES = ['correct', 'partial', 'incorrect', 'unanswered', 'pending'] as const;
export type ResponseStatus = (typeof RESPONSE_STATUSES)[number];

/** The numbers a fresh-numbers question was given: the engine's inputs, the stem's text, the worked steps. */
export interface DrawnNumbers {
  inputs: Record<string, unknown>;
  shown: Record<string, string>;
  steps: Step[];
}

/** A rubric criterion's marks, as the instructor gave them. */
export interface RubricMark {
  criterion: string;
  points: number;
  maxPoints: number;
}

/** One question of one attempt: what it was given, what was answered, and how it was graded. */
@Entity({ name: 'quiz_response' })
@Index('quiz_response_question_key', ['attemptId', 'questionId'], { unique: true })
@Index('quiz_response_version_idx', ['questionVersionId'])
export class QuizResponse {
  @PrimaryGeneratedColumn('uuid', { name: 'id' })
  id!: string;

  @Column({ name: 'attempt_id', type: 'uuid' })
  attemptId!: string;

  @ManyToOne(() => QuizAttempt, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'attempt_id', foreignKeyConstraintName: 'quiz_response_attempt_fkey' })
  attempt?: QuizAttempt;

  @Column({ name: 'question_version_id', type: 'uuid' })
  questionVersionId!: string;

  @ManyToOne(() => QuestionVersion, { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'question_version_id', foreignKeyConstraintName: 'quiz_response_version_fkey' })
  questionVersion?: QuestionVersion;

  @Column({ name: 'question_id', type: 'varchar', length: 80 })
  questionId!: string;

  @Column({ name: 'position', type: 'integer' })
  position!: number;

  @Column({ name: 'seed', type: 'integer' })
  seed!: number;

  /** Choice ids in the order this attempt shows them. */
  @Column({ name: 'choice_order', type: 'jsonb', nullable: true })
  choiceOrder!: string[] | null;

  @Column({ name: 'drawn', type: 'jsonb', nullable: true })
  drawn!: DrawnNumbers | null;

  /** The key for this attempt (a fresh-numbers question's key for its drawn numbers). */
  @Column({ name: 'key', type: 'jsonb', nullable: true })
  key!: Quantity | null;

  /** The latest autosaved answer (the draft until submit, then the answer graded). */
  @Column({ name: 'answer', type: 'jsonb', nullable: true })
  answer!: ResponseValue | null;

  @Column({ name: 'answered_at', type: 'timestamptz', nullable: true })
  answeredAt!: Date | null;

  @Column({ name: 'max_points', type: 'double precision' })
  maxPoints!: number;

  @Column({ name: 'points', type: 'double precision', nullable: true })
  points!: number | null;

  @Column({ name: 'status', type: 'enum', enum: RESPONSE_STATUSES, enumName: 'quiz_response_status', nullable: true })
  status!: ResponseStatus | null;

  @Column({ name: 'within_tolerance', type: 'boolean', nullable: true })
  withinTolerance!: boolean | null;

  @Column({ name: 'answer_in_key_unit', type: 'double precision', nullable: true })
  answerInKeyUnit!: number | null;

  @Column({ name: 'graded_at', type: 'timestamptz', nullable: true })
  gradedAt!: Date | null;

  @Column({ name: 'override_points', type: 'double precision', nullable: true })
  overridePoints!: number | null;

  @Column({ name: 'override_reason', type: 'text', nullable: true })
  overrideReason!: string | null;

  @Column({ name: 'override_by', type: 'uuid', nullable: true })
  overrideBy!: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'override_by', foreignKeyConstraintName: 'quiz_response_override_by_fkey' })
  overrider?: User | null;

  @Column({ name: 'override_at', type: 'timestamptz', nullable: true })
  overrideAt!: Date | null;

  @Column({ name: 'rubric_marks', type: 'jsonb', nullable: true })
  rubricMarks!: RubricMark[] | null;

  @Column({ name: 'grader_comment', type: 'text', nullable: true })
  graderComment!: string | null;

  @Column({ name: 'graded_by', type: 'uuid', nullable: true })
  gradedBy!: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'graded_by', foreignKeyConstraintName: 'quiz_response_graded_by_fkey' })
  grader?: User | null;
}
