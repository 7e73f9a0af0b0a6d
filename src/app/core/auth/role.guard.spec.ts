import { TestBed } from '@angular/core/testing';
import { ActivatedRouteSnapshot, RouterStateSnapshot, UrlTree, provideRouter } from '@angular/router';
import type { Role } from '@shared/schemas';
import { provideSession, restoreSession, sessionUser } from '../../../testing/session-users';
import { Notices } from '../notify/notices';
import { authGuard } from './auth.guard';
import { roleGuard } from './role.guard';

function signInAs(roles: Role[] | null): Promise<void> {
  TestBed.configureTestingModule({ providers: [provideRouter([]), provideSession(roles ? sessionUser(roles) : null)] });
  return restoreSession();
}

const run = (guard: ReturnType<typeof roleGuard>, url = '/admin/users') =>
  TestBed.runInInjectionContext(() => guard({} as ActivatedRouteSnapshot, { url } as RouterStateSnapshot));

describe('roleGuard', () => {
  it('lets a user through who holds one of the roles', async () => {
    await signInAs(['technologist', 'admin']);
    expect(run(roleGuard('admin'))).toBe(true);
  });

  it('sends a user lacking the roles home and says why', async () => {
    await signInAs(['technologist', 'director']);
    const result = run(roleGuard('admin', 'quality'));
    expect(result).toBeInstanceOf(UrlTree);
    expect(String(result)).toBe('/');
    expect(TestBed.inject(Notices).message()).toBe('Your roles do not include that page.');
  });
});

describe('authGuard', () => {
  it('sends a signed-out visitor to sign in, remembering where they were going', async () => {
    await signInAs(null);
    expect(String(run(authGuard, '/admin/users?x=1'))).toBe('/sign-in?next=%2Fadmin%2Fusers%3Fx%3D1');
  });

  it('lets a signed-in user through', async () => {
    await signInAs(['quality']);
    expect(run(authGuard)).toBe(true);
  });
});
