import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type {
  ChangePasswordBody,
  PasswordLinkInfo,
  PasswordResetAnswer,
  SessionUser,
  SignInBody,
} from '@shared/schemas';

/** The session and password routes of /api/v1 (relative URLs, so Angular adds the XSRF header). */
@Injectable({ providedIn: 'root' })
export class AuthApi {
  private readonly http = inject(HttpClient);

  session(): Observable<SessionUser> {
    return this.http.get<SessionUser>('/api/v1/session');
  }

  signIn(body: SignInBody): Observable<SessionUser> {
    return this.http.post<SessionUser>('/api/v1/session', body);
  }

  signOut(): Observable<void> {
    return this.http.delete<void>('/api/v1/session');
  }

  changePassword(body: ChangePasswordBody): Observable<void> {
    return this.http.put<void>('/api/v1/session/password', body);
  }

  /** "Forgot your password?": the answer is the same whether or not the e-mail has an account. */
  requestPasswordReset(email: string): Observable<PasswordResetAnswer> {
    return this.http.post<PasswordResetAnswer>('/api/v1/password-resets', { email });
  }

  passwordLink(token: string): Observable<PasswordLinkInfo> {
    return this.http.get<PasswordLinkInfo>(`/api/v1/password-links/${encodeURIComponent(token)}`);
  }

  setPassword(token: string, password: string): Observable<void> {
    return this.http.post<void>(`/api/v1/password-links/${encodeURIComponent(token)}`, { password });
  }
}
