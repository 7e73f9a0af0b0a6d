import { Injectable, computed, inject, signal } from '@angular/core';
import { Observable, catchError, firstValueFrom, map, of, tap } from 'rxjs';
import type { Role, SessionUser, SignInBody } from '@shared/schemas';
import { Notices } from '../notify/notices';
import { AuthApi } from './auth-api';

interface AuthState {
  user: SessionUser | null;
  /** True once the start-up probe has answered (signed in or not). */
  checked: boolean;
}

/** Who is signed in. Pages read the signals; the guards ask hasAnyRole(). */
@Injectable({ providedIn: 'root' })
export class AuthStore {
  private readonly api = inject(AuthApi);
  private readonly notices = inject(Notices);
  private readonly state = signal<AuthState>({ user: null, checked: false });

  readonly user = computed(() => this.state().user);
  readonly checked = computed(() => this.state().checked);
  readonly signedIn = computed(() => this.state().user !== null);
  readonly roles = computed<readonly Role[]>(() => this.state().user?.roles ?? []);

  /**
   * Asks the server who we are. Runs before the first page: it also makes the server set the
   * XSRF-TOKEN cookie that every later POST needs. Never fails: an error means "not signed in".
   */
  restore(): Promise<void> {
    const probe = this.api.session().pipe(
      catchError(() => of(null)),
      tap((user) => this.state.set({ user, checked: true })),
      map(() => undefined),
    );
    return firstValueFrom(probe);
  }

  /** Signs in; a notice still waiting from before ("You are signed out.") is dropped, not shown to the new session. */
  signIn(body: SignInBody): Observable<SessionUser> {
    return this.api.signIn(body).pipe(
      tap((user) => {
        this.notices.clear();
        this.state.set({ user, checked: true });
      }),
    );
  }

  signOut(): Observable<void> {
    return this.api.signOut().pipe(tap(() => this.forget()));
  }

  /** Drops the user locally, e.g. when the server says the session has ended. */
  forget(): void {
    this.state.set({ user: null, checked: true });
  }

  hasAnyRole(roles: readonly Role[]): boolean {
    const mine = this.roles();
    return roles.some((role) => mine.includes(role));
  }
}
