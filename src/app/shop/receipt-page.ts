import { DatePipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { RouterLink } from '@angular/router';

import type { OrderView } from '../../../shared/api/payments';
import { formatAmount } from '../../../shared/billing/pricing';
import { problemMessage } from '../core/problem';
import { ShopApi } from './shop-api';

/** `/shop/orders/:id`: a paid order's receipt, laid out to print (the top bar and footer do not print). */
@Component({
  selector: 'fl-receipt-page',
  imports: [DatePipe, MatButton, RouterLink],
  template: `
    <p class="back no-print"><a routerLink="/shop">← My shop</a></p>
    @if (order.hasValue() && shop.hasValue()) {
      @let o = order.value();
      <article class="receipt" aria-labelledby="receipt-heading">
        <h1 id="receipt-heading">Receipt for order {{ o.number }}</h1>
        @if (o.status !== 'paid') {
          <p role="alert">This order is not paid, so it has no receipt.</p>
        } @else {
          <dl>
            <dt>Seller</dt>
            <dd>Flowlore</dd>
            <dt>Bought for</dt>
            <dd>{{ shop.value().name }}</dd>
            <dt>Date paid</dt>
            <dd class="figures">{{ o.paidAt | date: 'yyyy-MM-dd' }}</dd>
            <dt>Seats</dt>
            <dd class="figures">{{ o.quantity }} × {{ money(o.unitAmount, o.currency) }}</dd>
            <dt>Total paid</dt>
            <dd class="figures total">{{ money(o.totalAmount, o.currency) }}</dd>
            <dt>Card</dt>
            <dd>{{ o.cardLast4 ? 'ending in ' + o.cardLast4 : 'as given on the payment page' }}</dd>
          </dl>
          <p class="no-print"><button matButton="outlined" type="button" (click)="print()">Print</button></p>
        }
      </article>
    } @else if (order.error() || shop.error()) {
      <p role="alert">{{ problem() }}</p>
    } @else {
      <p role="status">Loading the receipt…</p>
    }
  `,
  styles: `
    .receipt {
      max-width: 36rem;
    }

    dl {
      display: grid;
      grid-template-columns: max-content 1fr;
      gap: 0.5rem 1.5rem;
    }

    dt {
      font-weight: 600;
    }

    dd {
      margin: 0;
    }

    .total {
      font-weight: 700;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReceiptPage {
  /** The order's id, from the route. */
  readonly id = input.required<string>();
  protected readonly order = httpResource<OrderView>(() => `/api/shop/orders/${encodeURIComponent(this.id())}`);
  protected readonly shop = inject(ShopApi).mine();
  protected readonly problem = computed(() => problemMessage(this.order.error() ?? this.shop.error(), 'The receipt did not load.'));

  protected money(minor: number, currency: string): string {
    return formatAmount(minor, currency);
  }

  protected print(): void {
    window.print();
  }
}
