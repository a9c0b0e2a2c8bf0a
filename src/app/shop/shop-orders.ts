import { DatePipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';

import type { OrderStatus, OrderView } from '../../../shared/api/payments';
import { formatAmount } from '../../../shared/billing/pricing';

export const ORDER_STATUS_WORDS: Record<OrderStatus, string> = {
  pending: 'Waiting for payment',
  paid: 'Paid',
  expired: 'Not paid (the payment page closed)',
  failed: 'Not paid (the provider could not be reached)',
};

/** The shop page's orders: every purchase, its status in words, and the receipt of each paid one. */
@Component({
  selector: 'fl-shop-orders',
  imports: [DatePipe, MatButton, MatTableModule, RouterLink],
  template: `
    <section aria-labelledby="orders-heading">
      <h2 id="orders-heading">Orders</h2>
      @if (orders.hasValue()) {
        <div class="table-frame">
          <table mat-table [dataSource]="orders.value()" aria-labelledby="orders-heading">
            <ng-container matColumnDef="number">
              <th mat-header-cell *matHeaderCellDef>Order</th>
              <td mat-cell *matCellDef="let order" class="figures">{{ order.number }}</td>
            </ng-container>
            <ng-container matColumnDef="date">
              <th mat-header-cell *matHeaderCellDef>Date</th>
              <td mat-cell *matCellDef="let order" class="figures">{{ (order.paidAt ?? order.createdAt) | date: 'yyyy-MM-dd' }}</td>
            </ng-container>
            <ng-container matColumnDef="seats">
              <th mat-header-cell *matHeaderCellDef>Seats</th>
              <td mat-cell *matCellDef="let order" class="figures">{{ order.quantity }}</td>
            </ng-container>
            <ng-container matColumnDef="total">
              <th mat-header-cell *matHeaderCellDef>Total</th>
              <td mat-cell *matCellDef="let order" class="figures">{{ money(order.totalAmount, order.currency) }}</td>
            </ng-container>
            <ng-container matColumnDef="status">
              <th mat-header-cell *matHeaderCellDef>Status</th>
              <td mat-cell *matCellDef="let order">{{ statusOf(order) }}</td>
            </ng-container>
            <ng-container matColumnDef="receipt">
              <th mat-header-cell *matHeaderCellDef><span class="visually-hidden">Receipt</span></th>
              <td mat-cell *matCellDef="let order">
                @if (order.status === 'paid') {
                  <a [routerLink]="['/shop/orders', order.id]" [attr.aria-label]="'Receipt of order ' + order.number">Receipt</a>
                }
              </td>
            </ng-container>
            <tr mat-header-row *matHeaderRowDef="columns"></tr>
            <tr mat-row *matRowDef="let row; columns: columns"></tr>
            <tr class="mat-row" *matNoDataRow>
              <td class="mat-cell empty" [attr.colspan]="columns.length">No orders yet.</td>
            </tr>
          </table>
        </div>
      } @else if (orders.error()) {
        <p role="alert">Your orders did not load. <button matButton type="button" (click)="orders.reload()">Try again</button></p>
      } @else {
        <p role="status">Loading your orders…</p>
      }
    </section>
  `,
  styleUrls: ['../admin/admin-tables.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ShopOrders {
  protected readonly orders = httpResource<OrderView[]>(() => '/api/shop/orders');
  protected readonly columns = ['number', 'date', 'seats', 'total', 'status', 'receipt'];

  protected statusOf(order: OrderView): string {
    return ORDER_STATUS_WORDS[order.status];
  }

  protected money(minor: number, currency: string): string {
    return formatAmount(minor, currency);
  }

  /** Asks again (after a payment was confirmed on this page). */
  reload(): void {
    this.orders.reload();
  }
}
