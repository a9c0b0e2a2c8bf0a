import { HttpClient, httpResource, type HttpResourceRef } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { firstValueFrom } from 'rxjs';

import type { AdminUserChange, AdminUserQuery, AuditView, OutboxEntry, Page, UserSummary } from '../../../shared/api/accounts';

/** What the admin pages read and change (`/api/admin/*`). */
@Injectable({ providedIn: 'root' })
export class AdminApi {
  private readonly http = inject(HttpClient);

  /** Users, sorted, filtered and paged by the server; follows the query as it changes. */
  users(query: () => AdminUserQuery): HttpResourceRef<Page<UserSummary> | undefined> {
    return httpResource(
      () => {
        const { q, role, sort, order, page, pageSize } = query();
        const params: Record<string, string | number> = { sort, order, page, pageSize };
        if (q) params['q'] = q;
        if (role) params['role'] = role;
        return { url: '/api/admin/users', params };
      },
      { parse: parsePage<UserSummary> },
    );
  }

  outbox(page: () => { page: number; pageSize: number }): HttpResourceRef<Page<OutboxEntry> | undefined> {
    return httpResource(() => ({ url: '/api/admin/outbox', params: { ...page() } }), { parse: parsePage<OutboxEntry> });
  }

  audit(page: () => { page: number; pageSize: number }): HttpResourceRef<Page<AuditView> | undefined> {
    return httpResource(() => ({ url: '/api/admin/audit', params: { ...page() } }), { parse: parsePage<AuditView> });
  }

  /** A new role and/or enabling/disabling the account; the server audits it. */
  async changeUser(id: string, change: AdminUserChange): Promise<UserSummary> {
    return firstValueFrom(this.http.patch<UserSummary>(`/api/admin/users/${encodeURIComponent(id)}`, change));
  }
}

function parsePage<T>(raw: unknown): Page<T> {
  const page = raw as Partial<Page<T>> | null;
  if (typeof page !== 'object' || page === null || !Array.isArray(page.items) || typeof page.total !== 'number') {
    throw new Error('The list came back in an unexpected shape.');
  }
  return page as Page<T>;
}
