import { TestBed } from '@angular/core/testing';
import { of, throwError } from 'rxjs';
import type { Role, SessionUser } from '@shared/schemas';
import { AuthApi } from '../app/core/auth/auth-api';
import { AuthStore } from '../app/core/auth/auth-store';
import { ApiError } from '../app/core/http/api-error';

/** A signed-in user of the demo laboratory with the given roles, for unit tests. */
export function sessionUser(roles: Role[], name = 'Ada Tester'): SessionUser {
  return {
    id: 7,
    name,
    email: 'ada@valeharbor.example',
    roles,
    laboratory: { id: 1, name: 'Vale Harbor Regional Laboratory', timeZone: 'Europe/Lisbon' },
  };
}

/** The real AuthApi, except that its session probe answers `user` (or 401 for null) without HTTP. */
export function provideSession(user: SessionUser | null) {
  const useFactory = () => {
    const api = new AuthApi();
    api.session = () => (user ? of(user) : throwError(() => new ApiError(401, 'Not signed in')));
    return api;
  };
  return [{ provide: AuthApi, useFactory }];
}

/** Runs the start-up probe against provideSession()'s answer. */
export function restoreSession(): Promise<void> {
  return TestBed.inject(AuthStore).restore();
}
