import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatPaginator, type PageEvent } from '@angular/material/paginator';
import { MatTableModule } from '@angular/material/table';

import type { OutboxEntry } from '../../../shared/api/accounts';
import { AdminApi } from './admin-api';
import { keepLast } from './keep-last';

/** `/admin/outbox`: every message the app sent or failed to send, newest first; secret links are removed. */
@Component({
  selector: 'fl-outbox-page',
  imports: [DatePipe, MatButton, MatPaginator, MatTableModule],
  template: `
    <h2 class="visually-hidden">Sent e-mail</h2>
    <p class="intro">Every message Flowlore sent, newest first. Links that sign someone in or reset a password are removed from these copies.</p>
    @if (outbox.error()) {
      <p class="state" role="alert">The outbox did not load. <button matButton type="button" (click)="outbox.reload()">Try again</button></p>
    }
    <div class="table-frame">
      <table mat-table [dataSource]="shown()?.items ?? []" aria-label="Sent e-mail">
        <ng-container matColumnDef="createdAt">
          <th mat-header-cell *matHeaderCellDef>Time</th>
          <td mat-cell *matCellDef="let mail" class="figures">{{ mail.createdAt | date: 'yyyy-MM-dd HH:mm:ss' }}</td>
        </ng-container>
        <ng-container matColumnDef="to">
          <th mat-header-cell *matHeaderCellDef>To</th>
          <td mat-cell *matCellDef="let mail" class="email">{{ mail.to }}</td>
        </ng-container>
        <ng-container matColumnDef="subject">
          <th mat-header-cell *matHeaderCellDef>Subject</th>
          <td mat-cell *matCellDef="let mail">{{ mail.subject }}</td>
        </ng-container>
        <ng-container matColumnDef="status">
          <th mat-header-cell *matHeaderCellDef>Status</th>
          <td mat-cell *matCellDef="let mail">
            @if (mail.status === 'sent') { Sent } @else { <span class="failed" [title]="mail.error ?? ''">Failed</span> }
          </td>
        </ng-container>
        <ng-container matColumnDef="view">
          <th mat-header-cell *matHeaderCellDef><span class="visually-hidden">Message</span></th>
          <td mat-cell *matCellDef="let mail">
            <button matButton type="button" (click)="toggle(mail)" [attr.aria-expanded]="open()?.id === mail.id"
                    [attr.aria-controls]="'message-' + mail.id">
              {{ open()?.id === mail.id ? 'Hide' : 'View' }}<span class="visually-hidden"> message to {{ mail.to }}</span>
            </button>
          </td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
        <tr class="mat-row" *matNoDataRow>
          <td class="mat-cell empty" [attr.colspan]="columns.length">{{ !shown() ? 'Loading…' : 'No e-mail has been sent yet.' }}</td>
        </tr>
      </table>
    </div>
    <mat-paginator [length]="shown()?.total ?? 0" [pageIndex]="paging().page - 1" [pageSize]="paging().pageSize"
                   [pageSizeOptions]="[10, 25, 50, 100]" (page)="turnPage($event)" aria-label="Pages of sent e-mail" />
    @if (open(); as mail) {
      <section class="message" [id]="'message-' + mail.id" aria-labelledby="message-heading">
        <h3 id="message-heading">{{ mail.subject }}</h3>
        <p class="meta">To {{ mail.to }} · {{ mail.createdAt | date: 'yyyy-MM-dd HH:mm:ss' }} · template “{{ mail.template }}”</p>
        @if (mail.error) { <p class="failed">Not delivered: {{ mail.error }}</p> }
        <pre>{{ mail.text }}</pre>
      </section>
    }
  `,
  styleUrls: ['./admin-tables.scss', './outbox-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OutboxPage {
  protected readonly columns = ['createdAt', 'to', 'subject', 'status', 'view'];
  protected readonly paging = signal({ page: 1, pageSize: 25 });
  protected readonly outbox = inject(AdminApi).outbox(this.paging);
  /** The last page that arrived, kept while the next one loads. */
  protected readonly shown = keepLast(() => (this.outbox.hasValue() ? this.outbox.value() : undefined));
  protected readonly open = signal<OutboxEntry | null>(null);

  protected toggle(mail: OutboxEntry): void {
    this.open.update((current) => (current?.id === mail.id ? null : mail));
  }

  protected turnPage(event: PageEvent): void {
    this.paging.set({ page: event.pageIndex + 1, pageSize: event.pageSize });
  }
}
