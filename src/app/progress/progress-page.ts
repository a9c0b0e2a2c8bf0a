import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';

import { problemMessage } from '../core/problem';
import { LessonsService } from '../course/lessons.service';
import { progressRows } from './lesson-status';
import { ProgressApi } from './progress-api';

/** `/progress`: the apprentice's own lessons and quizzes, in words (the guard admits apprentices only). */
@Component({
  selector: 'fl-progress-page',
  imports: [DatePipe, MatButton, MatTableModule, RouterLink],
  template: `
    <h1>My progress</h1>
    @if (rows(); as rows) {
      <p class="lead">
        @if (lastActivity(); as last) {
          Last activity: <span class="figures">{{ last | date: 'yyyy-MM-dd HH:mm' }}</span>.
        } @else {
          Nothing yet: open the first lesson to begin.
        }
        {{ passedCount() }} of {{ quizCount() }} quizzes passed. Your best attempt at each quiz counts.
      </p>
      <div class="table-frame">
        <table mat-table [dataSource]="rows" aria-label="Lessons and quizzes">
          <ng-container matColumnDef="lesson">
            <th mat-header-cell *matHeaderCellDef>Lesson</th>
            <td mat-cell *matCellDef="let row"><a [routerLink]="['/course', row.slug]">{{ row.order }}. {{ row.title }}</a></td>
          </ng-container>
          <ng-container matColumnDef="reading">
            <th mat-header-cell *matHeaderCellDef>Reading</th>
            <td mat-cell *matCellDef="let row">{{ row.reading }}</td>
          </ng-container>
          <ng-container matColumnDef="quiz">
            <th mat-header-cell *matHeaderCellDef>Quiz</th>
            <td mat-cell *matCellDef="let row">
              <a [routerLink]="['/course', row.slug, 'quiz']" [attr.data-status]="row.quizTone">{{ row.quiz }}<span class="visually-hidden">: quiz of lesson {{ row.order }}</span></a>
            </td>
          </ng-container>
          <ng-container matColumnDef="best">
            <th mat-header-cell *matHeaderCellDef>Best score</th>
            <td mat-cell *matCellDef="let row" class="figures">{{ row.best }}</td>
          </ng-container>
          <ng-container matColumnDef="attempts">
            <th mat-header-cell *matHeaderCellDef>Attempts used</th>
            <td mat-cell *matCellDef="let row" class="figures">{{ row.attempts }}</td>
          </ng-container>
          <ng-container matColumnDef="lastActivity">
            <th mat-header-cell *matHeaderCellDef>Last activity</th>
            <td mat-cell *matCellDef="let row" class="figures">{{ row.lastActivity ? (row.lastActivity | date: 'yyyy-MM-dd HH:mm') : '—' }}</td>
          </ng-container>
          <tr mat-header-row *matHeaderRowDef="columns"></tr>
          <tr mat-row *matRowDef="let row; columns: columns"></tr>
        </table>
      </div>
    } @else if (progress.error() || outline.error()) {
      <p role="alert">{{ problem() }} <button matButton type="button" (click)="retry()">Try again</button></p>
    } @else {
      <p role="status">Loading your progress…</p>
    }
  `,
  styleUrls: ['../admin/admin-tables.scss'],
  styles: `
    .lead {
      max-width: 68ch;
      margin: 0 0 1.5rem;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProgressPage {
  protected readonly progress = inject(ProgressApi).mine();
  protected readonly outline = inject(LessonsService).outline();
  protected readonly columns = ['lesson', 'reading', 'quiz', 'best', 'attempts', 'lastActivity'];

  protected readonly rows = computed(() =>
    this.progress.hasValue() && this.outline.hasValue() ? progressRows(this.outline.value(), this.progress.value()) : undefined,
  );
  protected readonly lastActivity = computed(() => (this.progress.hasValue() ? this.progress.value().lastActivity : null));
  protected readonly quizCount = computed(() => (this.progress.hasValue() ? this.progress.value().quizzes.length : 0));
  protected readonly passedCount = computed(() => (this.progress.hasValue() ? this.progress.value().quizzes.filter((q) => q.status === 'passed').length : 0));

  protected problem(): string {
    return problemMessage(this.progress.error() ?? this.outline.error(), 'Your progress did not load.');
  }

  protected retry(): void {
    this.progress.reload();
    this.outline.reload();
  }
}
