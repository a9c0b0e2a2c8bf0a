import { HttpClient, httpResource, type HttpResourceRef } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { firstValueFrom } from 'rxjs';

import type { CohortDetail, CohortSummary } from '../../../shared/api/accounts';
import { problemDisplay } from '../core/problem';

/** An instructor's cohorts (`/api/cohorts/*`). */
@Injectable({ providedIn: 'root' })
export class CohortsApi {
  private readonly http = inject(HttpClient);

  list(): HttpResourceRef<CohortSummary[] | undefined> {
    return httpResource(() => '/api/cohorts', { parse: parseList });
  }

  detail(id: () => string): HttpResourceRef<CohortDetail | undefined> {
    return httpResource(() => `/api/cohorts/${encodeURIComponent(id())}`, { parse: parseDetail });
  }

  async create(name: string): Promise<CohortSummary> {
    return firstValueFrom(this.http.post<CohortSummary>('/api/cohorts', { name }, { context: problemDisplay('form') }));
  }

  /** Adds an apprentice account by its e-mail address; answers with the cohort as it now is. */
  async addMember(cohortId: string, email: string): Promise<CohortDetail> {
    return firstValueFrom(this.http.post<CohortDetail>(`/api/cohorts/${encodeURIComponent(cohortId)}/members`, { email }, { context: problemDisplay('form') }));
  }

  async removeMember(cohortId: string, userId: string): Promise<void> {
    await firstValueFrom(this.http.delete<void>(`/api/cohorts/${encodeURIComponent(cohortId)}/members/${encodeURIComponent(userId)}`));
  }
}

function parseList(raw: unknown): CohortSummary[] {
  if (!Array.isArray(raw) || !raw.every((c: Partial<CohortSummary>) => typeof c?.id === 'string' && typeof c.name === 'string')) {
    throw new Error('The cohorts came back in an unexpected shape.');
  }
  return raw;
}

function parseDetail(raw: unknown): CohortDetail {
  const cohort = raw as Partial<CohortDetail> | null;
  if (typeof cohort?.id !== 'string' || !Array.isArray(cohort.members)) throw new Error('The cohort came back in an unexpected shape.');
  return cohort as CohortDetail;
}
