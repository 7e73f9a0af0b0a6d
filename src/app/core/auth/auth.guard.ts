import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { AuthStore } from './auth-store';

/** Lets a signed-in user through; anyone else goes to sign in and comes back afterwards. */
export const authGuard: CanActivateFn = (_route, state) => {
  if (inject(AuthStore).signedIn()) return true;
  return inject(Router).createUrlTree(['/sign-in'], { queryParams: { next: state.url } });
};
