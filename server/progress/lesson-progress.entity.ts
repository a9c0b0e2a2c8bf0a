import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';

import { User } from '../accounts/user.entity';

/** When an apprentice first opened a lesson, when they finished it, and when they last came back. */
@Entity({ name: 'lesson_progress' })
export class LessonProgress {
  @PrimaryColumn({ name: 'user_id', type: 'uuid' })
  userId!: string;

  @PrimaryColumn({ name: 'lesson_slug', type: 'varchar', length: 80 })
  lessonSlug!: string;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'lesson_progress_user_fkey' })
  user?: User;

  @Column({ name: 'opened_at', type: 'timestamptz' })
  openedAt!: Date;

  @Column({ name: 'finished_at', type: 'timestamptz', nullable: true })
  finishedAt!: Date | null;

  @Column({ name: 'last_activity_at', type: 'timestamptz' })
  lastActivityAt!: Date;
}
