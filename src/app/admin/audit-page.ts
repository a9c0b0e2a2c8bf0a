import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatPaginator, type PageEvent } from '@angular/material/paginator';
import { MatTableModule } from '@angular/material/table';

import type { AuditView, Role } from '../../../shared/api/accounts';
import { ROLE_LABELS } from '../account/role-labels';
import { AdminApi } from './admin-api';
import { keepLast } from './keep-last';

const ACTION_LABELS: Readonly<Record<string, string>> = {
  'account.created': 'Account created',
  'role.changed': 'Role changed',
  'account.disabled': 'Account disabled',
  'account.enabled': 'Account enabled',
};

/** `/admin/audit`: who changed a role or an account's access, and when; newest first. */
@Component({
  selector: 'fl-audit-page',
  imports: [DatePipe, MatButton, MatPaginator, MatTableModule],
  template: `
    <h2 class="visually-hidden">Audit log</h2>
    @if (audit.error()) {
      <p class="state" role="alert">The audit log did not load. <button matButton type="button" (click)="audit.reload()">Try again</button></p>
    }
    <div class="table-frame">
      <table mat-table [dataSource]="shown()?.items ?? []" aria-label="Audit log">
        <ng-container matColumnDef="at">
          <th mat-header-cell *matHeaderCellDef>Time</th>
          <td mat-cell *matCellDef="let entry" class="figures">{{ entry.at | date: 'yyyy-MM-dd HH:mm:ss' }}</td>
        </ng-container>
        <ng-container matColumnDef="action">
          <th mat-header-cell *matHeaderCellDef>Action</th>
          <td mat-cell *matCellDef="let entry">{{ actionLabel(entry.action) }}</td>
        </ng-container>
        <ng-container matColumnDef="actor">
          <th mat-header-cell *matHeaderCellDef>By</th>
          <td mat-cell *matCellDef="let entry">
            @if (entry.actor; as actor) {
              <span [title]="actor.email">{{ actor.displayName }}</span>
            } @else {
              {{ entry.actorId ? 'A deleted account' : 'The system (command line or seed)' }}
            }
          </td>
        </ng-container>
        <ng-container matColumnDef="target">
          <th mat-header-cell *matHeaderCellDef>Account</th>
          <td mat-cell *matCellDef="let entry">
            @if (entry.target; as target) {
              <span [title]="target.email">{{ target.displayName }}</span>
            } @else {
              {{ entry.targetId ? 'A deleted account' : '—' }}
            }
          </td>
        </ng-container>
        <ng-container matColumnDef="detail">
          <th mat-header-cell *matHeaderCellDef>Detail</th>
          <td mat-cell *matCellDef="let entry" class="detail">{{ describe(entry) }}</td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
        <tr class="mat-row" *matNoDataRow>
          <td class="mat-cell empty" [attr.colspan]="columns.length">{{ !shown() ? 'Loading…' : 'Nothing has been recorded yet.' }}</td>
        </tr>
      </table>
    </div>
    <mat-paginator [length]="shown()?.total ?? 0" [pageIndex]="paging().page - 1" [pageSize]="paging().pageSize"
                   [pageSizeOptions]="[10, 25, 50, 100]" (page)="turnPage($event)" aria-label="Pages of the audit log" />
  `,
  styleUrls: ['./admin-tables.scss'],
  styles: `
    .detail {
      overflow-wrap: anywhere;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuditPage {
  protected readonly columns = ['at', 'action', 'actor', 'target', 'detail'];
  protected readonly paging = signal({ page: 1, pageSize: 25 });
  protected readonly audit = inject(AdminApi).audit(this.paging);
  /** The last page that arrived, kept while the next one loads. */
  protected readonly shown = keepLast(() => (this.audit.hasValue() ? this.audit.value() : undefined));

  protected actionLabel(action: string): string {
    return ACTION_LABELS[action] ?? action;
  }

  /** A role change reads "Apprentice → Instructor"; anything else shows its recorded detail compactly. */
  protected describe(entry: AuditView): string {
    const { from, to } = entry.detail as { from?: Role; to?: Role };
    if (entry.action === 'role.changed' && from && to) return `${ROLE_LABELS[from] ?? from} → ${ROLE_LABELS[to] ?? to}`;
    return Object.keys(entry.detail).length ? JSON.stringify(entry.detail) : '—';
  }

  protected turnPage(event: PageEvent): void {
    this.paging.set({ page: event.pageIndex + 1, pageSize: event.pageSize });
  }
}
