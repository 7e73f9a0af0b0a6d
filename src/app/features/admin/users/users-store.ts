import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { InviteUserBody, UpdateUserBody, User } from '@shared/schemas';
import { ListStore } from '../catalog/list-store';
import { UsersApi } from './users-api';

@Injectable({ providedIn: 'root' })
export class UsersStore extends ListStore<User> {
  private readonly api = inject(UsersApi);

  protected fetch(): Observable<User[]> {
    return this.api.list();
  }

  invite(body: InviteUserBody): Observable<User> {
    return this.save(this.api.invite(body));
  }

  update(id: number, body: UpdateUserBody): Observable<User> {
    return this.save(this.api.update(id, body));
  }

  unlock(id: number): Observable<User> {
    return this.save(this.api.unlock(id));
  }

  resendInvitation(id: number): Observable<void> {
    return this.api.resendInvitation(id);
  }

  sendPasswordLink(id: number): Observable<void> {
    return this.api.sendPasswordLink(id);
  }
}
