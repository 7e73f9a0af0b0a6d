import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { Observable, filter, switchMap } from 'rxjs';
import type { User } from '@shared/schemas';
import { AuthStore } from '../../../../core/auth/auth-store';
import { ApiError } from '../../../../core/http/api-error';
import { Notices } from '../../../../core/notify/notices';
import { ConfirmDialog, ConfirmData } from '../../../../ui/confirm-dialog/confirm-dialog';
import { ErrorBanner } from '../../../../ui/error-banner';
import { FilterField } from '../../../../ui/filter-field';
import { RoleNamesPipe, roleNames } from '../../../../ui/role-names';
import { TableView } from '../../../../ui/table-view';
import { UserDialog } from '../user-dialog/user-dialog';
import { UserState, isLocked, userState } from '../user-state';
import { UsersStore } from '../users-store';

interface UserRow {
  user: User;
  state: UserState;
  locked: boolean;
}

function sortValue(row: UserRow, column: string): string {
  if (column === 'roles') return roleNames(row.user.roles);
  if (column === 'state') return row.state.text;
  return column === 'email' ? row.user.email : row.user.name;
}

/** Admin › Users: every account of the laboratory, and what an administrator does with them. */
@Component({
  selector: 'app-user-list',
  templateUrl: './user-list.html',
  styleUrl: '../../catalog/catalog-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    MatTableModule, MatSortModule, MatButtonModule, MatIconModule, MatMenuModule, MatProgressBarModule,
    ErrorBanner, FilterField, RoleNamesPipe,
  ],
})
export class UserList {
  protected readonly store = inject(UsersStore);
  private readonly auth = inject(AuthStore);
  private readonly dialogs = inject(MatDialog);
  private readonly notices = inject(Notices);
  private readonly now = signal(new Date());

  protected readonly columns = ['name', 'email', 'roles', 'state', 'actions'];
  private readonly rowsOfStore = computed<UserRow[]>(() => {
    const timeZone = this.auth.user()?.laboratory.timeZone ?? 'UTC';
    return this.store.items().map((user) => ({
      user,
      state: userState(user, this.now(), timeZone),
      locked: isLocked(user, this.now()),
    }));
  });
  protected readonly view = new TableView<UserRow>(
    this.rowsOfStore,
    (r) => `${r.user.name} ${r.user.email} ${roleNames(r.user.roles)} ${r.user.roles.join(' ')} ${r.state.text}`,
    (r, column) => sortValue(r, column),
  );

  constructor() {
    this.reload();
  }

  protected reload(): void {
    this.now.set(new Date());
    this.store.load();
  }

  protected invite(): void {
    this.dialogs.open(UserDialog, { width: '520px' }).afterClosed().pipe(filter(Boolean)).subscribe((user) =>
      this.notices.post(`Invitation sent to ${user.email}.`),
    );
  }

  protected edit(user: User): void {
    this.dialogs.open(UserDialog, { width: '520px', data: { user } }).afterClosed().pipe(filter(Boolean)).subscribe((saved) =>
      this.notices.post(`${saved.name} is saved.`),
    );
  }

  protected setActive(user: User, active: boolean): void {
    const change = () => this.store.update(user.id, { active });
    if (active) return this.run(change(), `${user.name} can sign in again.`);
    const data: ConfirmData = {
      title: `Deactivate ${user.name}?`,
      text: 'They can no longer sign in. Their work stays in the laboratory’s records, and you can reactivate them later.',
      action: 'Deactivate',
    };
    this.dialogs.open(ConfirmDialog, { data }).afterClosed().pipe(filter(Boolean), switchMap(change)).subscribe({
      next: () => this.notices.post(`${user.name} is deactivated.`),
      error: (err: ApiError) => this.notices.post(err.message),
    });
  }

  protected unlock(user: User): void {
    this.run(this.store.unlock(user.id), `${user.name} is unlocked.`);
  }

  protected resendInvitation(user: User): void {
    this.run(this.store.resendInvitation(user.id), `A new invitation is on its way to ${user.email}.`);
  }

  protected sendPasswordLink(user: User): void {
    this.run(this.store.sendPasswordLink(user.id), `A password link is on its way to ${user.email}; it works once, for one hour.`);
  }

  private run(request: Observable<unknown>, done: string): void {
    request.subscribe({ next: () => this.notices.post(done), error: (err: ApiError) => this.notices.post(err.message) });
  }
}
