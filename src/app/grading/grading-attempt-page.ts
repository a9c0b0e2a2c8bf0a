import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import type { GradedResponse, GradingAttempt } from '../../../shared/api/grading';
import { QuizHtml } from '../quizzes/quiz-html';
import { GradingApi } from './grading-api';
import { OverrideDialog, type OverrideRequest } from './override-dialog';

type AttemptResponse = GradingAttempt['responses'][number];

const STATUS_WORDS: Record<string, string> = {
  correct: 'Correct',
  partial: 'Part right',
  incorrect: 'Not right',
  unanswered: 'Not answered',
  pending: 'Waiting for a grade',
};

/** `/grading/attempts/:id`: one submitted attempt for its grader, with an override per auto-graded answer. */
@Component({
  selector: 'fl-grading-attempt-page',
  imports: [DatePipe, DecimalPipe, MatButton, QuizHtml, RouterLink],
  templateUrl: './grading-attempt-page.html',
  styleUrl: './grading.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class GradingAttemptPage {
  private readonly api = inject(GradingApi);
  private readonly dialog = inject(MatDialog);

  /** The attempt's id, from the address. */
  readonly id = input.required<string>();
  protected readonly attempt = this.api.attempt(this.id);
  protected readonly changed = signal<string | null>(null);

  protected statusWords(status: string | null): string {
    return status ? (STATUS_WORDS[status] ?? status) : 'Not graded';
  }

  protected async override(response: AttemptResponse): Promise<void> {
    const data: OverrideRequest = {
      responseId: response.responseId,
      questionId: response.questionId,
      points: response.points,
      maxPoints: response.maxPoints,
      current: response.override ? { points: response.override.points, reason: response.override.reason } : null,
    };
    const ref = this.dialog.open<OverrideDialog, OverrideRequest, GradedResponse>(OverrideDialog, { data, maxWidth: '32rem', width: '100%' });
    const graded = await firstValueFrom(ref.afterClosed());
    if (!graded) return;
    this.changed.set(`“${response.questionId}” now counts ${graded.points} of ${graded.maxPoints} points; the attempt scores ${Math.round(graded.attempt.percent * 10) / 10} %.`);
    this.attempt.reload();
  }
}
