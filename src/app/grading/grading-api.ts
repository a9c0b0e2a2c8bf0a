import { HttpClient, httpResource, type HttpResourceRef } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { firstValueFrom } from 'rxjs';

import type { GradeResponseRequest, GradedResponse, GradingAttempt, GradingQueue, OverrideResponseRequest } from '../../../shared/api/grading';
import { problemDisplay } from '../core/problem';

/** The instructor's grading (`/api/grading/*`): the queue, rubric marks, overrides. */
@Injectable({ providedIn: 'root' })
export class GradingApi {
  private readonly http = inject(HttpClient);

  queue(): HttpResourceRef<GradingQueue | undefined> {
    return httpResource(() => '/api/grading/queue?limit=200', { parse: parseQueue });
  }

  attempt(id: () => string): HttpResourceRef<GradingAttempt | undefined> {
    return httpResource(() => `/api/grading/attempts/${encodeURIComponent(id())}`, { parse: parseAttempt });
  }

  async grade(responseId: string, body: GradeResponseRequest): Promise<GradedResponse> {
    return firstValueFrom(this.http.put<GradedResponse>(`/api/grading/responses/${encodeURIComponent(responseId)}`, body, { context: problemDisplay('form') }));
  }

  async override(responseId: string, body: OverrideResponseRequest): Promise<GradedResponse> {
    return firstValueFrom(
      this.http.post<GradedResponse>(`/api/grading/responses/${encodeURIComponent(responseId)}/override`, body, { context: problemDisplay('form') }),
    );
  }
}

function parseQueue(raw: unknown): GradingQueue {
  const queue = raw as Partial<GradingQueue> | null;
  if (!Array.isArray(queue?.items) || typeof queue.total !== 'number') throw new Error('The grading queue came back in an unexpected shape.');
  return queue as GradingQueue;
}

function parseAttempt(raw: unknown): GradingAttempt {
  const attempt = raw as Partial<GradingAttempt> | null;
  if (typeof attempt?.id !== 'string' || !Array.isArray(attempt.responses)) throw new Error('The attempt came back in an unexpected shape.');
  return attempt as GradingAttempt;
}
