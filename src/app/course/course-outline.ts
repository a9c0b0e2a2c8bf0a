import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { RouterLink } from '@angular/router';

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

  protected retry(): void {
    this.outline.reload();
  }
}
