import { DatePipe, DecimalPipe } from '@angular/common';
import { HttpClient, httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { firstValueFrom } from 'rxjs';

import type { CorrectedQuestion, RegradeResult } from '../../../shared/api/grading';
import { problemDisplay } from '../core/problem';

/**
 * On the grading page: auto-graded questions corrected since some of the instructor's apprentices
 * answered them, with a button that grades those answers again against the question as it is now,
 * on the numbers each attempt was given, and says whose score changed.
 */
@Component({
  selector: 'fl-corrected-questions',
  imports: [DatePipe, DecimalPipe, MatButton],
  template: `
    @if (corrections.hasValue() && corrections.value().length > 0) {
      <section aria-labelledby="corrections-heading" class="corrections">
        <h2 id="corrections-heading">Corrected questions</h2>
        <p class="lead">
          These questions were corrected after some of your apprentices answered them. Their answers were graded against the
          earlier version. A regrade grades them again against the question as it is now, on the numbers each attempt was
          given. Scores that change are listed here, and those apprentices get a notification.
        </p>
        <ul class="correction-list">
          @for (c of corrections.value(); track c.quiz.slug + c.questionId) {
            <li>
              <p>
                <strong>{{ c.quiz.title }}</strong>, question {{ c.questionNumber }} (now version {{ c.currentVersion }}):
                {{ c.earlierAnswers === 1 ? '1 answer' : c.earlierAnswers + ' answers' }} to an earlier version.
                @if (c.lastRegradedAt; as at) {
                  Last regraded <span class="figures">{{ at | date: 'yyyy-MM-dd HH:mm' }}</span>.
                } @else {
                  Not regraded yet.
                }
              </p>
              <button matButton="outlined" type="button" [disabled]="busy()" (click)="regrade(c)"
                      [attr.aria-label]="'Regrade question ' + c.questionNumber + ' of ' + c.quiz.title">Regrade</button>
            </li>
          }
        </ul>
        <div role="status" class="regrade-result">
          @if (result(); as r) {
            <p>
              Regraded {{ r.responsesRegraded === 1 ? '1 answer' : r.responsesRegraded + ' answers' }} against version {{ r.currentVersion }}.
              {{ r.changed.length === 0 ? 'No score changed.' : 'Scores that changed:' }}
            </p>
            @if (r.changed.length > 0) {
              <ul>
                @for (change of r.changed; track change.attemptId) {
                  <li>
                    {{ change.apprentice.displayName }}, attempt {{ change.attemptNumber }}:
                    <span class="figures">{{ change.old.percent | number: '1.0-1' }} % → {{ change.new.percent | number: '1.0-1' }} %</span>
                    ({{ change.new.passed ? 'a pass' : 'not yet a pass' }}{{ change.old.passed !== change.new.passed ? (change.old.passed ? ', was a pass' : ', was not') : '' }})
                  </li>
                }
              </ul>
            }
          }
        </div>
      </section>
    }
  `,
  styles: `
    .corrections {
      margin-block-start: 2rem;
    }

    .lead {
      max-width: 68ch;
    }

    .correction-list {
      max-width: 68ch;
      padding: 0;
      list-style: none;

      li {
        padding-block: 0.5rem;
        border-bottom: 1px solid var(--mat-sys-outline-variant);
      }

      p {
        margin: 0 0 0.5rem;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CorrectedQuestions {
  private readonly http = inject(HttpClient);
  protected readonly corrections = httpResource<CorrectedQuestion[]>(() => '/api/grading/corrections');
  protected readonly busy = signal(false);
  protected readonly result = signal<RegradeResult | null>(null);

  protected async regrade(question: CorrectedQuestion): Promise<void> {
    this.busy.set(true);
    try {
      const result = await firstValueFrom(
        this.http.post<RegradeResult>('/api/grading/regrade', { quizSlug: question.quiz.slug, questionId: question.questionId }, { context: problemDisplay('snackbar') }),
      );
      this.result.set(result);
      this.corrections.reload();
    } catch {
      // The snackbar has said why; the list stays as it was.
    } finally {
      this.busy.set(false);
    }
  }
}
