import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatTableModule } from '@angular/material/table';

import { problemMessage } from '../core/problem';
import { ShopApi } from './shop-api';

/** `/shop`: the shop owner's shop and its apprentices. Seats and invitations come later. */
@Component({
  selector: 'fl-shop-page',
  imports: [MatButton, MatTableModule],
  template: `
    @if (shop.hasValue()) {
      @let current = shop.value();
      <h1>{{ current.name }}</h1>
      <p class="lead">Owner: {{ current.owner.displayName }}</p>

      <div class="notice" role="note">
        <p>
          <strong>Seats are not on sale yet.</strong> Buying seats and inviting apprentices by e-mail
          come in a later version of Flowlore. Until then this page lists the apprentices already linked
          to your shop.
        </p>
      </div>

      <h2 id="apprentices-heading">Apprentices</h2>
      <div class="table-frame">
        <table mat-table [dataSource]="current.apprentices" aria-labelledby="apprentices-heading">
          <ng-container matColumnDef="displayName">
            <th mat-header-cell *matHeaderCellDef>Name</th>
            <td mat-cell *matCellDef="let apprentice">{{ apprentice.displayName }}</td>
          </ng-container>
          <ng-container matColumnDef="email">
            <th mat-header-cell *matHeaderCellDef>E-mail</th>
            <td mat-cell *matCellDef="let apprentice" class="email">{{ apprentice.email }}</td>
          </ng-container>
          <ng-container matColumnDef="verified">
            <th mat-header-cell *matHeaderCellDef>E-mail confirmed</th>
            <td mat-cell *matCellDef="let apprentice">{{ apprentice.verified ? 'Yes' : 'Not yet' }}</td>
          </ng-container>
          <tr mat-header-row *matHeaderRowDef="columns"></tr>
          <tr mat-row *matRowDef="let row; columns: columns"></tr>
          <tr class="mat-row" *matNoDataRow>
            <td class="mat-cell empty" [attr.colspan]="columns.length">No apprentices are linked to your shop yet.</td>
          </tr>
        </table>
      </div>
    } @else if (shop.error()) {
      <h1>My shop</h1>
      <p role="alert">{{ problem() }} <button matButton type="button" (click)="shop.reload()">Try again</button></p>
    } @else {
      <h1>My shop</h1>
      <p role="status">Loading your shop…</p>
    }
  `,
  styleUrls: ['../admin/admin-tables.scss', './shop-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ShopPage {
  protected readonly shop = inject(ShopApi).mine();
  protected readonly columns = ['displayName', 'email', 'verified'];

  protected problem(): string {
    return problemMessage(this.shop.error(), 'Your shop did not load.');
  }
}
