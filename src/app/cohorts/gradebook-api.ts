import { httpResource, type HttpResourceRef } from '@angular/common/http';
import { Injectable } from '@angular/core';

import type { GradebookCsvQuery, GradebookPage, GradebookQuery } from '../../../shared/api/gradebook';

/** A cohort's gradebook (`GET /api/cohorts/:id/gradebook`), sorted, filtered and paged on the server. */
@Injectable({ providedIn: 'root' })
export class GradebookApi {
  page(cohortId: () => string, query: () => GradebookQuery): HttpResourceRef<GradebookPage | undefined> {
    return httpResource(() => ({ url: `/api/cohorts/${encodeURIComponent(cohortId())}/gradebook`, params: queryParams(query()) }), { parse: parsePage });
  }

  /** The CSV's address: the same sort and filters, every row. A plain link downloads it with the session cookie. */
  csvUrl(cohortId: string, query: GradebookCsvQuery): string {
    const params = new URLSearchParams(Object.entries(queryParams(query)).map(([k, v]) => [k, String(v)]));
    return `/api/cohorts/${encodeURIComponent(cohortId)}/gradebook.csv?${params}`;
  }
}

function queryParams(query: GradebookCsvQuery & Partial<Pick<GradebookQuery, 'page' | 'pageSize'>>): Record<string, string | number> {
  const params: Record<string, string | number> = { sort: query.sort, dir: query.dir };
  if (query.status) params['status'] = query.status;
  if (query.quiz) params['quiz'] = query.quiz;
  if (query.q) params['q'] = query.q;
  if (query.page) params['page'] = query.page;
  if (query.pageSize) params['pageSize'] = query.pageSize;
  return params;
}

function parsePage(raw: unknown): GradebookPage {
  const page = raw as Partial<GradebookPage> | null;
  if (!Array.isArray(page?.rows) || !Array.isArray(page.quizzes) || typeof page.total !== 'number') {
    throw new Error('The gradebook came back in an unexpected shape.');
  }
  return page as GradebookPage;
}
