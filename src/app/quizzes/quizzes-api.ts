import { HttpClient, HttpErrorResponse, httpResource, type HttpResourceRef } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { firstValueFrom } from 'rxjs';

import type { AnswerValue, AttemptView, QuizSummary, SavedAnswer } from '../../../shared/api/quizzes';
import { problemDisplay, problemMessage, problemOf } from '../core/problem';
import type { SaveFailure } from './answer-saver';

/** Quizzes and attempts (`/api/quizzes`, `/api/attempts/*`): the apprentice's side. */
@Injectable({ providedIn: 'root' })
export class QuizzesApi {
  private readonly http = inject(HttpClient);

  /** Every quiz with the caller's attempts used, best score and status. */
  list(): HttpResourceRef<QuizSummary[] | undefined> {
    return httpResource(() => '/api/quizzes', { parse: parseList });
  }

  /** One attempt: the questions to answer while open, the result once submitted. No request while `id` gives undefined. */
  attempt(id: () => string | undefined): HttpResourceRef<AttemptView | undefined> {
    return httpResource(() => {
      const current = id();
      return current === undefined ? undefined : `/api/attempts/${encodeURIComponent(current)}`;
    }, { parse: parseAttempt });
  }

  /** The page shows a refusal (no attempts left) itself. */
  async start(slug: string): Promise<AttemptView> {
    return parseAttempt(await firstValueFrom(this.http.post<unknown>(`/api/quizzes/${encodeURIComponent(slug)}/attempts`, {}, { context: problemDisplay('page') })));
  }

  /** Autosave of one answer. The question shows what went wrong itself (no snackbar). */
  async saveAnswer(attemptId: string, questionId: string, answer: AnswerValue | null): Promise<SavedAnswer> {
    const url = `/api/attempts/${encodeURIComponent(attemptId)}/answers/${encodeURIComponent(questionId)}`;
    return firstValueFrom(this.http.put<SavedAnswer>(url, { answer }, { context: problemDisplay('page') }));
  }

  /** Final; a repeat answers with the same result. */
  async submit(attemptId: string): Promise<AttemptView> {
    return parseAttempt(await firstValueFrom(this.http.post<unknown>(`/api/attempts/${encodeURIComponent(attemptId)}/submit`, {}, { context: problemDisplay('page') })));
  }
}

/** How a failed autosave counts: a 400 is refused (its message shown), a 409 closes the attempt, no answer or a server fault is tried again. */
export function saveFailureOf(error: unknown): SaveFailure {
  const status = error instanceof HttpErrorResponse ? error.status : 0;
  if (status === 0 || status >= 500 || status === 429 || status === 408) {
    return { outcome: 'retry', message: 'Not saved yet: no connection. It will be sent again; keep going.' };
  }
  const problem = problemOf(error);
  const message = problem?.errors?.[0]?.message ?? problemMessage(error, 'This answer was not saved.');
  return { outcome: status === 409 ? 'closed' : 'refused', message };
}

// The server builds these shapes from shared/api/quizzes.ts; the checks catch a proxy's error page
// or a half-deployed server, not every field.

function parseList(raw: unknown): QuizSummary[] {
  if (!Array.isArray(raw) || !raw.every((q: Partial<QuizSummary>) => typeof q?.slug === 'string' && typeof q.passMark === 'number')) {
    throw new Error('The quizzes came back in an unexpected shape.');
  }
  return raw;
}

function parseAttempt(raw: unknown): AttemptView {
  const attempt = raw as Partial<AttemptView> | null;
  if (typeof attempt?.id !== 'string' || !Array.isArray(attempt.questions) || typeof attempt.quiz?.slug !== 'string') {
    throw new Error('The attempt came back in an unexpected shape.');
  }
  return attempt as AttemptView;
}
