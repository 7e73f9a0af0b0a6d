import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { InviteUserBody, UpdateUserBody, User } from '@shared/schemas';

/** /api/v1/users: the laboratory's accounts. */
@Injectable({ providedIn: 'root' })
export class UsersApi {
  private readonly http = inject(HttpClient);

  list(): Observable<User[]> {
    return this.http.get<User[]>('/api/v1/users');
  }

  /** Creates the account; the server e-mails a one-time set-password link (valid 72 h). */
  invite(body: InviteUserBody): Observable<User> {
    return this.http.post<User>('/api/v1/users', body);
  }

  update(id: number, body: UpdateUserBody): Observable<User> {
    return this.http.patch<User>(`/api/v1/users/${id}`, body);
  }

  unlock(id: number): Observable<User> {
    return this.http.post<User>(`/api/v1/users/${id}/unlock`, {});
  }

  resendInvitation(id: number): Observable<void> {
    return this.http.post<void>(`/api/v1/users/${id}/invitation`, {});
  }

  /** E-mails the user a one-time link (valid 1 h) to choose a new password; their older unused links stop working. */
  sendPasswordLink(id: number): Observable<void> {
    return this.http.post<void>(`/api/v1/users/${id}/password-link`, {});
  }
}
