import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatPaginator, type PageEvent } from '@angular/material/paginator';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSort, MatSortHeader, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { debounceTime, distinctUntilChanged, map } from 'rxjs';

import type { AdminUserQuery, Role, UserSummary } from '../../../shared/api/accounts';
import { ROLE_LABELS } from '../account/role-labels';
import { AuthService } from '../core/auth.service';
import { askToConfirm } from '../core/confirm-dialog';
import { AdminApi } from './admin-api';
import { keepLast } from './keep-last';

type SortColumn = AdminUserQuery['sort'];
const ROLES = Object.keys(ROLE_LABELS) as Role[];

/** `/admin/users`: every account, searched, sorted and paged on the server; role and access changed here. */
@Component({
  selector: 'fl-users-page',
  imports: [DatePipe, MatButton, MatFormField, MatInput, MatLabel, MatOption, MatPaginator, MatSelect, MatSort, MatSortHeader, MatTableModule, ReactiveFormsModule],
  templateUrl: './users-page.html',
  styleUrls: ['./admin-tables.scss', './users-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UsersPage {
  private readonly api = inject(AdminApi);
  private readonly dialog = inject(MatDialog);
  protected readonly me = inject(AuthService).user;
  protected readonly roles = ROLES;
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly columns = ['displayName', 'email', 'role', 'status', 'createdAt', 'actions'];

  protected readonly search = new FormControl('', { nonNullable: true });
  protected readonly roleFilter = new FormControl<Role | ''>('', { nonNullable: true });
  private readonly q = toSignal(
    this.search.valueChanges.pipe(
      debounceTime(300),
      map((text) => text.trim()),
      distinctUntilChanged(),
    ),
    { initialValue: '' },
  );
  private readonly role = toSignal(this.roleFilter.valueChanges, { initialValue: '' as Role | '' });
  protected readonly sort = signal<{ active: SortColumn; direction: 'asc' | 'desc' }>({ active: 'createdAt', direction: 'desc' });
  protected readonly paging = signal({ pageIndex: 0, pageSize: 25 });
  protected readonly busy = signal<string | null>(null);

  private readonly query = computed<AdminUserQuery>(() => ({
    q: this.q() || undefined,
    role: this.role() || undefined,
    sort: this.sort().active,
    order: this.sort().direction,
    page: this.paging().pageIndex + 1,
    pageSize: this.paging().pageSize,
  }));
  protected readonly users = this.api.users(this.query);
  /** The rows on screen: the last page that arrived, kept while the next one loads (no flicker). */
  protected readonly shown = keepLast(() => (this.users.hasValue() ? this.users.value() : undefined));

  constructor() {
    // A new search or role filter starts again at the first page.
    this.search.valueChanges.pipe(debounceTime(300), takeUntilDestroyed()).subscribe(() => this.firstPage());
    this.roleFilter.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.firstPage());
  }

  private firstPage(): void {
    this.paging.update((p) => ({ ...p, pageIndex: 0 }));
  }

  protected sortBy(sort: Sort): void {
    this.sort.set(sort.direction ? { active: sort.active as SortColumn, direction: sort.direction } : { active: 'createdAt', direction: 'desc' });
    this.firstPage();
  }

  protected turnPage(event: PageEvent): void {
    this.paging.set({ pageIndex: event.pageIndex, pageSize: event.pageSize });
  }

  protected async changeRole(user: UserSummary, role: Role): Promise<void> {
    if (role === user.role) return;
    await this.change(user, { role });
  }

  protected async toggleDisabled(user: UserSummary): Promise<void> {
    const disabling = !user.disabled;
    const confirmed = await askToConfirm(this.dialog, {
      title: disabling ? `Disable ${user.displayName}?` : `Enable ${user.displayName}?`,
      message: disabling
        ? `${user.email} will be signed out everywhere at once and cannot sign in until an administrator enables the account again.`
        : `${user.email} will be able to sign in again.`,
      confirm: disabling ? 'Disable account' : 'Enable account',
    });
    if (confirmed) await this.change(user, { disabled: disabling });
  }

  private async change(user: UserSummary, change: { role?: Role; disabled?: boolean }): Promise<void> {
    this.busy.set(user.id);
    try {
      await this.api.changeUser(user.id, change);
    } catch {
      // The snackbar has said why; the reload below puts the row back as the server has it.
    } finally {
      this.busy.set(null);
      this.users.reload();
    }
  }
}
