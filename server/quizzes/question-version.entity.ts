import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

import type { QuestionDefinition } from '../../shared/quiz/definition';

export interface QuestionHtml {
  stem: string;
  explanation: string;
  choices?: Record<string, string>;
}

/**
 * One version of a question as the server served it. A question whose definition changes (a new
 * fingerprint) gets the next version number; attempts point at the version they were given.
 */
@Entity({ name: 'question_version' })
@Index('question_version_number_key', ['quizSlug', 'questionId', 'version'], { unique: true })
@Index('question_version_fingerprint_key', ['quizSlug', 'questionId', 'fingerprint'], { unique: true })
export class QuestionVersion {
  @PrimaryGeneratedColumn('uuid', { name: 'id' })
  id!: string;

  @Column({ name: 'quiz_slug', type: 'varchar', length: 80 })
  quizSlug!: string;

  @Column({ name: 'question_id', type: 'varchar', length: 80 })
  questionId!: string;

  @Column({ name: 'version', type: 'integer' })
  version!: number;

  @Column({ name: 'fingerprint', type: 'varchar', length: 64 })
  fingerprint!: string;

  @Column({ name: 'definition', type: 'jsonb' })
  definition!: QuestionDefinition;

  /** The version's stem, explanation and choices as rendered (sanitised HTML), kept with it. */
  @Column({ name: 'html', type: 'jsonb' })
  html!: QuestionHtml;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz', default: () => 'now()' })
  createdAt!: Date;
}
