import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import type { Role } from '@shared/schemas';
import { Notices } from '../notify/notices';
import { AuthStore } from './auth-store';

/** Mirrors the server's role checks: a user without one of `roles` goes home with a message. */
export function roleGuard(...roles: Role[]): CanActivateFn {
  return () => {
    if (inject(AuthStore).hasAnyRole(roles)) return true;
    inject(Notices).post('Your roles do not include that page.');
    return inject(Router).parseUrl('/');
  };
}
