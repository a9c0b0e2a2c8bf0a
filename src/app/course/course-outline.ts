import { ChangeDetectionStrategy, Component } from '@angular/core';
import { RouterLink } from '@angular/router';

/** Placeholder until the course outline lands: says so plainly and points to what works today. */
@Component({
  selector: 'fl-course-outline',
  imports: [RouterLink],
  template: `
    <h1>Course</h1>
    <p class="prose">
      The course outline is on its way. The nine lessons are being written and will appear here,
      each with its calculators, quiz and safety notes.
    </p>
    <p class="prose">Until then, <a routerLink="/">see what the nine lessons cover</a>.</p>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CourseOutline {}
