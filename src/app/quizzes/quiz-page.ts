import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal, untracked, viewChildren } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { Router, RouterLink } from '@angular/router';

import type { AttemptView } from '../../../shared/api/quizzes';
import { AuthService } from '../core/auth.service';
import { askToConfirm } from '../core/confirm-dialog';
import { problemMessage } from '../core/problem';
import { formatPercent } from '../progress/lesson-status';
import { formatRemaining, isAnnouncedMoment, remainingInWords } from './quiz-answers';
import { QuizQuestion } from './quiz-question';
import { QuizResult } from './quiz-result';
import { QuizzesApi } from './quizzes-api';

/**
 * `/course/:slug/quiz`: the lesson's quiz. Without `?attempt=` the intro (questions, pass mark,
 * attempts left, time limit, best score) and start; with it, the attempt: one form with every
 * question while it is open, the result once it is submitted.
 */
@Component({
  selector: 'fl-quiz-page',
  imports: [MatButton, QuizQuestion, QuizResult, RouterLink],
  templateUrl: './quiz-page.html',
  styleUrl: './quiz-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class QuizPage {
  /** The lesson's slug, from the route. */
  readonly slug = input.required<string>();
  /** The attempt shown, from the query (`?attempt=`). */
  readonly attempt = input<string | undefined>(undefined);

  private readonly api = inject(QuizzesApi);
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);
  protected readonly auth = inject(AuthService);

  protected readonly quizzes = this.api.list();
  protected readonly summary = computed(() => (this.quizzes.hasValue() ? this.quizzes.value().find((q) => q.slug === this.slug()) : undefined));
  protected readonly noSuchQuiz = computed(() => this.quizzes.hasValue() && this.summary() === undefined);
  protected readonly current = this.api.attempt(() => this.attempt());
  protected readonly view = computed<AttemptView | undefined>(() => {
    const view = this.current.hasValue() ? this.current.value() : undefined;
    return view?.id === this.attempt() ? view : undefined;
  });
  protected readonly attemptsLeft = computed(() => {
    const quiz = this.summary();
    return quiz ? Math.max(0, quiz.attemptLimit - quiz.attemptsUsed) : 0;
  });
  protected readonly isApprentice = computed(() => this.auth.role() === 'apprentice');

  protected readonly busy = signal(false);
  protected readonly actionProblem = signal<string | null>(null);
  private readonly questions = viewChildren(QuizQuestion);

  // The countdown: the server keeps the real deadline; this clock only shows it.
  private readonly now = signal(Date.now());
  protected readonly remainingMs = computed(() => {
    const deadline = this.view()?.deadline;
    return deadline && this.view()?.status === 'open' ? Date.parse(deadline) - this.now() : null;
  });
  protected readonly clock = computed(() => {
    const ms = this.remainingMs();
    return ms === null ? null : formatRemaining(ms);
  });
  /** Said to screen readers at 10, 5, 2 and 1 minutes and 30 seconds left, not every second. */
  protected readonly announcement = signal('');
  private timeUpHandled = false;

  protected readonly formatPercent = formatPercent;

  constructor() {
    const ticker = setInterval(() => {
      if (this.view()?.deadline && this.view()?.status === 'open') this.now.set(Date.now());
    }, 1000);
    inject(DestroyRef).onDestroy(() => clearInterval(ticker));

    effect(() => {
      const ms = this.remainingMs();
      if (ms === null) return;
      untracked(() => {
        if (isAnnouncedMoment(ms)) this.announcement.set(remainingInWords(ms));
        if (ms <= 0 && !this.timeUpHandled) {
          this.timeUpHandled = true;
          // The server grades what was saved by the deadline; asking again shows the result.
          setTimeout(() => this.current.reload(), 1500);
        }
      });
    });
  }

  protected async start(): Promise<void> {
    await this.run(async () => {
      const view = await this.api.start(this.slug());
      this.quizzes.reload();
      this.timeUpHandled = false;
      await this.router.navigate([], { queryParams: { attempt: view.id } });
    });
  }

  protected async submit(): Promise<void> {
    const view = this.view();
    if (!view) return;
    const questions = this.questions();
    const states = await Promise.all(questions.map((q) => q.flush()));
    const unsaved = states.filter((s) => s.status === 'retrying' || s.status === 'waiting' || s.status === 'saving').length;
    const refused = states.filter((s) => s.status === 'refused').length;
    const answered = questions.filter((q) => q.answered()).length;
    const notes = [`You answered ${answered} of ${view.questions.length} questions.`];
    if (unsaved > 0) notes.push(`${unsaved === 1 ? '1 answer is' : `${unsaved} answers are`} not saved yet (no connection) and would not count.`);
    if (refused > 0) notes.push(`${refused === 1 ? '1 answer was' : `${refused} answers were`} not accepted; the last saved version counts.`);
    notes.push('You cannot change your answers after this.');
    const confirmed = await askToConfirm(this.dialog, { title: 'Submit your answers?', message: notes.join(' '), confirm: 'Submit answers' });
    if (!confirmed) return;
    await this.run(async () => {
      const result = await this.api.submit(view.id);
      this.current.set(result);
      this.quizzes.reload();
    });
  }

  protected retry(): void {
    this.quizzes.reload();
    if (this.attempt()) this.current.reload();
  }

  protected loadProblem(): string {
    return problemMessage(this.current.error() ?? this.quizzes.error(), 'The quiz did not load.');
  }

  protected attemptMissing(): boolean {
    const error = this.current.error();
    return error instanceof HttpErrorResponse && (error.status === 404 || error.status === 403);
  }

  private async run(action: () => Promise<void>): Promise<void> {
    this.busy.set(true);
    this.actionProblem.set(null);
    try {
      await action();
    } catch (error) {
      this.actionProblem.set(problemMessage(error));
    } finally {
      this.busy.set(false);
    }
  }
}
