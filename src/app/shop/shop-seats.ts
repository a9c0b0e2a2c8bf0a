import { DatePipe } from '@angular/common';
import { HttpClient, httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, DestroyRef, inject, output, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, Router } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import { MAX_INVITATIONS_PER_REQUEST, type InviteResult, type SeatRow, type ShopSeats as SeatsView } from '../../../shared/api/seats';
import type { CheckoutStart, OrderView } from '../../../shared/api/payments';
import { MAX_SEATS_PER_ORDER, MIN_SEATS_PER_ORDER, formatAmount, quoteSeats, type SeatPricing, type SeatQuote } from '../../../shared/billing/pricing';
import { askToConfirm } from '../core/confirm-dialog';
import { problemDisplay, problemMessage, problemOf } from '../core/problem';
import { pastedAddresses } from './pasted-addresses';

/**
 * The shop page's seats: the balance, inviting apprentices by e-mail (each invitation holds a seat
 * for 14 days), and the seats in use with resend, withdraw and release.
 */
@Component({
  selector: 'fl-shop-seats',
  imports: [DatePipe, MatButton, MatFormField, MatHint, MatInput, MatLabel, MatTableModule, ReactiveFormsModule],
  template: `
    <section aria-labelledby="seats-heading">
      <h2 id="seats-heading">Seats</h2>
      @if (seats.hasValue()) {
        @let s = seats.value();
        <p class="balance">
          <span class="figures">{{ s.purchased - s.refunded }}</span> paid for ·
          <span class="figures">{{ s.inUse }}</span> in use ·
          <strong><span class="figures">{{ s.available }}</span> free</strong>
        </p>
        <div role="status" class="payment">
          @if (confirming(); as c) {
            <p>{{ c }}</p>
          }
        </div>
        @if (s.buying) {
          <form class="buy" [formGroup]="buyForm" (ngSubmit)="buy(s.pricing)" novalidate>
            <mat-form-field class="quantity">
              <mat-label>Seats to buy</mat-label>
              <input matInput type="number" inputmode="numeric" min="1" max="500" step="1" [formControl]="quantity" />
              <mat-hint>{{ priceLine(s.pricing) }}</mat-hint>
            </mat-form-field>
            <button matButton="filled" type="submit" [disabled]="busy() || !quote(s.pricing)">Buy {{ quote(s.pricing) ? formatAmount(quote(s.pricing)!.totalAmount, s.pricing.currency) : '' }}</button>
          </form>
          <p class="small">You pay on the payment provider's page and come back here; the seats are added as soon as the provider confirms the payment.</p>
        } @else if (s.purchased === 0) {
          <p class="notice" role="note">Your shop has no seats yet, and this server does not take payments. Ask Flowlore to add seats to your shop.</p>
        }

        <form class="invite" [formGroup]="inviteForm" (ngSubmit)="invite()" novalidate>
          <mat-form-field class="addresses">
            <mat-label>E-mail addresses to invite</mat-label>
            <textarea matInput [formControl]="addresses" rows="3"></textarea>
            <mat-hint>One per line, or separated by commas; up to {{ maxInvites }} at a time. Each invitation holds a seat for 14 days.</mat-hint>
          </mat-form-field>
          <button matButton="filled" type="submit" [disabled]="busy()">Invite</button>
        </form>
        <div role="status" class="outcome">
          @if (outcome(); as o) {
            <p>{{ o }}</p>
          }
        </div>

        <div class="table-frame">
          <table mat-table [dataSource]="s.seats" aria-label="Seats in use">
            <ng-container matColumnDef="who">
              <th mat-header-cell *matHeaderCellDef>Apprentice</th>
              <td mat-cell *matCellDef="let seat">{{ seat.holder?.displayName ?? seat.invitation?.email }}</td>
            </ng-container>
            <ng-container matColumnDef="state">
              <th mat-header-cell *matHeaderCellDef>Seat</th>
              <td mat-cell *matCellDef="let seat">
                @if (seat.state === 'assigned') {
                  Taken since <span class="figures">{{ seat.since | date: 'yyyy-MM-dd' }}</span>
                } @else {
                  Invited, open until <span class="figures">{{ seat.invitation.expiresAt | date: 'yyyy-MM-dd' }}</span>
                }
              </td>
            </ng-container>
            <ng-container matColumnDef="progress">
              <th mat-header-cell *matHeaderCellDef>Progress</th>
              <td mat-cell *matCellDef="let seat">
                @if (seat.progress; as p) {
                  {{ p.lessonsFinished }} lessons finished, {{ p.quizzesPassed }} quizzes passed
                } @else {
                  —
                }
              </td>
            </ng-container>
            <ng-container matColumnDef="actions">
              <th mat-header-cell *matHeaderCellDef><span class="visually-hidden">Actions</span></th>
              <td mat-cell *matCellDef="let seat" class="actions">
                @if (seat.state === 'invited') {
                  <button matButton type="button" [disabled]="busy()" (click)="resend(seat)" [attr.aria-label]="'Send the invitation to ' + seat.invitation.email + ' again'">Send again</button>
                  <button matButton type="button" [disabled]="busy()" (click)="withdraw(seat)" [attr.aria-label]="'Withdraw the invitation to ' + seat.invitation.email">Withdraw</button>
                } @else {
                  <button matButton type="button" [disabled]="busy()" (click)="release(seat)" [attr.aria-label]="'Release the seat of ' + seat.holder.displayName">Release</button>
                }
              </td>
            </ng-container>
            <tr mat-header-row *matHeaderRowDef="columns"></tr>
            <tr mat-row *matRowDef="let row; columns: columns"></tr>
            <tr class="mat-row" *matNoDataRow>
              <td class="mat-cell empty" [attr.colspan]="columns.length">No seat is in use yet.</td>
            </tr>
          </table>
        </div>
      } @else if (seats.error()) {
        <p role="alert">{{ problem() }} <button matButton type="button" (click)="seats.reload()">Try again</button></p>
      } @else {
        <p role="status">Loading your seats…</p>
      }
    </section>
  `,
  styles: `
    .balance {
      font-size: 1.125rem;
    }

    .notice {
      max-width: 44rem;
      padding: 0.75rem 1rem;
      border-inline-start: 4px solid var(--mat-sys-tertiary);
      background: var(--mat-sys-surface-container);
    }

    .invite {
      display: flex;
      flex-wrap: wrap;
      gap: 1rem;
      align-items: flex-start;
      max-width: 44rem;
    }

    .addresses {
      flex: 1 1 20rem;
    }

    .buy {
      display: flex;
      flex-wrap: wrap;
      gap: 1rem;
      align-items: flex-start;
      max-width: 44rem;
    }

    .quantity {
      flex: 0 1 26rem;
    }

    .small {
      max-width: 44rem;
      font-size: 0.875rem;
      color: var(--mat-sys-on-surface-variant);
    }

    .outcome p {
      max-width: 44rem;
    }

    .actions {
      white-space: nowrap;
    }
  `,
  styleUrls: ['../admin/admin-tables.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ShopSeatsPanel {
  private readonly http = inject(HttpClient);
  private readonly dialog = inject(MatDialog);
  protected readonly seats = httpResource<SeatsView>(() => '/api/shop/seats');
  protected readonly addresses = new FormControl('', { nonNullable: true });
  protected readonly inviteForm = new FormGroup({ addresses: this.addresses });
  protected readonly quantity = new FormControl<number | null>(5);
  protected readonly buyForm = new FormGroup({ quantity: this.quantity });
  private readonly quantityValue = toSignal(this.quantity.valueChanges, { initialValue: this.quantity.value });
  /** A payment was confirmed here (the orders list asks again). */
  readonly paid = output<void>();
  /** While coming back from the provider's page: what we know of the payment so far. */
  protected readonly confirming = signal<string | null>(null);
  protected readonly formatAmount = formatAmount;
  private readonly route = inject(ActivatedRoute);
  private readonly router = inject(Router);

  constructor() {
    const query = this.route.snapshot.queryParamMap;
    const orderId = query.get('order');
    if (orderId && query.get('cancelled')) this.confirming.set('The payment was cancelled; nothing was charged.');
    else if (orderId) void this.confirm(orderId);
    inject(DestroyRef).onDestroy(() => (this.stopped = true));
  }

  private stopped = false;

  protected quote(pricing: SeatPricing): SeatQuote | null {
    const n = Number(this.quantityValue());
    try {
      return quoteSeats(pricing, n);
    } catch {
      return null;
    }
  }

  protected priceLine(pricing: SeatPricing): string {
    const quote = this.quote(pricing);
    if (!quote) return `A whole number of seats from ${MIN_SEATS_PER_ORDER} to ${MAX_SEATS_PER_ORDER}.`;
    return `${quote.quantity} × ${formatAmount(quote.unitAmount, pricing.currency)} = ${formatAmount(quote.totalAmount, pricing.currency)} (${pricing.tiers
      .map((t) => `${formatAmount(t.unitAmount, pricing.currency)} from ${t.fromSeats}`)
      .join(', ')})`;
  }

  protected async buy(pricing: SeatPricing): Promise<void> {
    const quote = this.quote(pricing);
    if (!quote) return;
    await this.run(async () => {
      const start = await firstValueFrom(this.http.post<CheckoutStart>('/api/shop/orders', { quantity: quote.quantity }, { context: problemDisplay('page') }));
      window.location.assign(start.checkoutUrl);
    });
  }

  /** Back from the provider's page: ask until its event has credited the seats (or the order ended). */
  private async confirm(orderId: string): Promise<void> {
    this.confirming.set('Confirming your payment…');
    for (let i = 0; i < 40 && !this.stopped; i++) {
      try {
        const order = await firstValueFrom(this.http.get<OrderView>(`/api/shop/orders/${encodeURIComponent(orderId)}`, { context: problemDisplay('background') }));
        if (order.status === 'paid') {
          this.confirming.set(`Payment received: ${order.quantity === 1 ? '1 seat was' : `${order.quantity} seats were`} added (order ${order.number}). A receipt is on its way by e-mail.`);
          this.seats.reload();
          this.paid.emit();
          void this.router.navigate([], { queryParams: {}, replaceUrl: true });
          return;
        }
        if (order.status !== 'pending') {
          this.confirming.set(order.status === 'expired' ? 'The payment page closed before a payment; nothing was charged.' : 'The payment did not go through; nothing was charged.');
          return;
        }
      } catch {
        // Keep asking: the page may have come back before the connection did.
      }
      await new Promise((resolve) => setTimeout(resolve, 1500));
    }
    if (!this.stopped) this.confirming.set('The payment is not confirmed yet. It can take a minute; reload this page to see your seats.');
  }
  protected readonly busy = signal(false);
  protected readonly outcome = signal<string | null>(null);
  protected readonly columns = ['who', 'state', 'progress', 'actions'];
  protected readonly maxInvites = MAX_INVITATIONS_PER_REQUEST;

  protected problem(): string {
    return problemMessage(this.seats.error(), 'Your seats did not load.');
  }

  protected async invite(): Promise<void> {
    const emails = pastedAddresses(this.addresses.value);
    if (emails.length === 0) {
      this.outcome.set('Enter at least one e-mail address to invite.');
      return;
    }
    await this.run(async () => {
      const result = await firstValueFrom(this.http.post<InviteResult>('/api/shop/invitations', { emails }, { context: problemDisplay('page') })).catch((error: unknown) => {
        // Name the addresses the server refused (its field errors point at emails.N).
        const refused = (problemOf(error)?.errors ?? []).map((e) => {
          const index = /^emails\.(\d+)$/.exec(e.field)?.[1];
          return index === undefined ? e.message : `${emails[Number(index)]}: ${e.message}`;
        });
        if (refused.length === 0) throw error;
        throw new Error(`Nobody was invited. ${refused.join(' ')}`);
      });
      const skipped = result.skipped.map((s) => `${s.email} (${s.reason})`).join('; ');
      this.outcome.set(
        `Invited ${result.invited.length === 1 ? '1 address' : `${result.invited.length} addresses`}.` +
          (skipped ? ` Not invited: ${skipped}` : '') +
          ` ${result.available === 1 ? '1 seat is' : `${result.available} seats are`} free.`,
      );
      if (result.invited.length > 0) this.addresses.reset('');
    });
  }

  protected async resend(seat: SeatRow): Promise<void> {
    await this.run(async () => {
      await firstValueFrom(this.http.post(`/api/shop/invitations/${seat.invitation!.id}/resend`, {}, { context: problemDisplay('page') }));
      this.outcome.set(`The invitation to ${seat.invitation!.email} was sent again, with a new link; the old link no longer works.`);
    });
  }

  protected async withdraw(seat: SeatRow): Promise<void> {
    const ok = await askToConfirm(this.dialog, {
      title: `Withdraw the invitation to ${seat.invitation!.email}?`,
      message: 'Its link stops working and the seat is free again.',
      confirm: 'Withdraw',
    });
    if (!ok) return;
    await this.run(async () => {
      await firstValueFrom(this.http.delete(`/api/shop/invitations/${seat.invitation!.id}`, { context: problemDisplay('page') }));
      this.outcome.set(`The invitation to ${seat.invitation!.email} was withdrawn; its seat is free.`);
    });
  }

  protected async release(seat: SeatRow): Promise<void> {
    const ok = await askToConfirm(this.dialog, {
      title: `Release the seat of ${seat.holder!.displayName}?`,
      message: 'They keep their progress and quiz history, but cannot open the paid lessons until they have a seat again. You can give the seat to someone else.',
      confirm: 'Release',
    });
    if (!ok) return;
    await this.run(async () => {
      await firstValueFrom(this.http.post(`/api/shop/seats/${seat.seatId}/release`, {}, { context: problemDisplay('page') }));
      this.outcome.set(`${seat.holder!.displayName}'s seat is free again.`);
    });
  }

  private async run(action: () => Promise<void>): Promise<void> {
    this.busy.set(true);
    this.outcome.set(null);
    try {
      await action();
      this.seats.reload();
    } catch (error) {
      this.outcome.set(error instanceof Error && !('status' in error) ? error.message : problemMessage(error, 'That did not work. Try again in a moment.'));
    } finally {
      this.busy.set(false);
    }
  }
}
