import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatTableModule } from '@angular/material/table';

import { problemMessage } from '../core/problem';
import { ShopApi } from './shop-api';
import { ShopOrders } from './shop-orders';
import { ShopSeatsPanel } from './shop-seats';

/**
 * `/shop`: the shop owner's shop, its apprentices and their progress (read-only: lessons finished,
 * quizzes passed, last activity; answers, scores and comments stay between apprentice and instructor).
 * Seats: the balance, invitations and the seats in use (`ShopSeatsPanel`).
 */
@Component({
  selector: 'fl-shop-page',
  imports: [DatePipe, MatButton, MatTableModule, ShopOrders, ShopSeatsPanel],
  template: `
    @if (shop.hasValue()) {
      @let current = shop.value();
      <h1>{{ current.name }}</h1>
      <p class="lead">Owner: {{ current.owner.displayName }}</p>

      <fl-shop-seats (paid)="orders.reload()" />
      <fl-shop-orders #orders />

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

      <h2 id="progress-heading">Progress</h2>
      <p class="lead">How far each apprentice has got. Answers, scores and instructors’ comments are not shown here.</p>
      @if (progress.hasValue()) {
        @let report = progress.value();
        <div class="table-frame">
          <table mat-table [dataSource]="report.apprentices" aria-labelledby="progress-heading">
            <ng-container matColumnDef="displayName">
              <th mat-header-cell *matHeaderCellDef>Name</th>
              <th mat-cell *matCellDef="let apprentice" scope="row" class="mat-mdc-cell mdc-data-table__cell row-name">{{ apprentice.displayName }}</th>
            </ng-container>
            <ng-container matColumnDef="lessons">
              <th mat-header-cell *matHeaderCellDef>Lessons finished</th>
              <td mat-cell *matCellDef="let apprentice" class="figures">{{ apprentice.lessonsFinished }} of {{ report.lessonCount }}</td>
            </ng-container>
            <ng-container matColumnDef="quizzes">
              <th mat-header-cell *matHeaderCellDef>Quizzes passed</th>
              <td mat-cell *matCellDef="let apprentice" class="figures">{{ apprentice.quizzesPassed }} of {{ report.quizCount }}</td>
            </ng-container>
            <ng-container matColumnDef="lastActivity">
              <th mat-header-cell *matHeaderCellDef>Last activity</th>
              <td mat-cell *matCellDef="let apprentice" class="figures">
                {{ apprentice.lastActivity ? (apprentice.lastActivity | date: 'yyyy-MM-dd') : 'None yet' }}
              </td>
            </ng-container>
            <tr mat-header-row *matHeaderRowDef="progressColumns"></tr>
            <tr mat-row *matRowDef="let row; columns: progressColumns"></tr>
            <tr class="mat-row" *matNoDataRow>
              <td class="mat-cell empty" [attr.colspan]="progressColumns.length">No apprentices are linked to your shop yet.</td>
            </tr>
          </table>
        </div>
      } @else if (progress.error()) {
        <p role="alert">The progress did not load. <button matButton type="button" (click)="progress.reload()">Try again</button></p>
      } @else {
        <p role="status">Loading the progress…</p>
      }
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
  private readonly api = inject(ShopApi);
  protected readonly shop = this.api.mine();
  protected readonly progress = this.api.progress();
  protected readonly columns = ['displayName', 'email', 'verified'];
  protected readonly progressColumns = ['displayName', 'lessons', 'quizzes', 'lastActivity'];

  protected problem(): string {
    return problemMessage(this.shop.error(), 'Your shop did not load.');
  }
}
