import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import type { AnswerValue, AttemptView, QuestionResult } from '../../../shared/api/quizzes';
import { formatFigure, unitSuffix } from '../calculators/unit-labels';
import { WorkedSteps } from '../calculators/worked-steps';
import { formatPercent } from '../progress/lesson-status';
import { QuizHtml } from './quiz-html';

const STATUS_WORDS: Record<QuestionResult['status'], string> = {
  correct: 'Right',
  partial: 'Partly right',
  incorrect: 'Not right',
  unanswered: 'Not answered',
  pending: 'Waiting for your instructor',
};

/**
 * A submitted attempt: the score and pass or not in words, then per question the answer, the
 * key, the tolerance, the explanation and — for numeric questions — the engine's worked steps
 * with this attempt's numbers. Written answers wait for the instructor, then show the marks.
 */
@Component({
  selector: 'fl-quiz-result',
  imports: [QuizHtml, WorkedSteps],
  templateUrl: './quiz-result.html',
  styleUrl: './quiz-result.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class QuizResult {
  readonly attempt = input.required<AttemptView>();

  protected readonly statusWords = STATUS_WORDS;
  protected readonly formatPercent = formatPercent;
  protected readonly score = computed(() => this.attempt().score);

  protected figure(value: number, unit: string): string {
    const suffix = unitSuffix(unit);
    return suffix === '' ? formatFigure(value) : `${formatFigure(value)} ${suffix}`;
  }

  protected numberAnswer(answer: AnswerValue | null): { value: number; unit: string } | null {
    return answer && 'value' in answer ? answer : null;
  }

  protected textAnswer(answer: AnswerValue | null): string | null {
    return answer && 'text' in answer ? answer.text : null;
  }

  protected chose(answer: AnswerValue | null, choiceId: string): boolean {
    if (!answer) return false;
    if ('choiceId' in answer) return answer.choiceId === choiceId;
    if ('choiceIds' in answer) return answer.choiceIds.includes(choiceId);
    return false;
  }

  protected pointsText(result: QuestionResult): string {
    if (result.points === null) return `out of ${result.maxPoints}`;
    return `${Number(result.points.toFixed(2))} of ${result.maxPoints} ${result.maxPoints === 1 ? 'point' : 'points'}`;
  }
}
