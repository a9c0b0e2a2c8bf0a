import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { RouterLink } from '@angular/router';

import { AuthService } from '../core/auth.service';
import { type LessonStatus, lessonStatus } from '../progress/lesson-status';
import { ProgressApi } from '../progress/progress-api';
import { LessonsService } from './lessons.service';

/** The course: the ten lessons in order, each with what it covers and what the reader can do after. */
@Component({
  selector: 'fl-course-outline',
  imports: [MatButton, RouterLink],
  templateUrl: './course-outline.html',
  styleUrl: './course-outline.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CourseOutline {
  protected readonly outline = inject(LessonsService).outline();
  private readonly auth = inject(AuthService);
  /** A signed-in apprentice's own progress; nobody else's is asked for. */
  protected readonly progress = inject(ProgressApi).mine(() => this.auth.role() === 'apprentice', 'background');
  protected readonly statuses = computed(() => {
    const statuses = new Map<string, LessonStatus>();
    if (!this.progress.hasValue() || this.auth.role() !== 'apprentice') return statuses;
    const { lessons, quizzes } = this.progress.value();
    for (const lesson of this.outline.hasValue() ? this.outline.value() : []) {
      statuses.set(lesson.slug, lessonStatus(lessons.find((l) => l.slug === lesson.slug), quizzes.find((q) => q.slug === lesson.slug)));
    }
    return statuses;
  });

  protected retry(): void {
    this.outline.reload();
  }
}
