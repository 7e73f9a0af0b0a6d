import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { Role } from '../../../../../shared/schemas';
import { provideSession, restoreSession, sessionUser } from '../../../../testing/session-users';
import { navigationFor } from '../../../core/layout/navigation';
import { WorklistPage } from './worklist-page';

async function render(roles: Role[]) {
  TestBed.configureTestingModule({ providers: [provideRouter([]), provideSession(sessionUser(roles, 'Lee Lead'))] });
  await restoreSession();
  const fixture = TestBed.createComponent(WorklistPage);
  await fixture.whenStable();
  return fixture.nativeElement as HTMLElement;
}

describe('WorklistPage', () => {
  it('welcomes the user and says what each of their roles is for', async () => {
    const el = await render(['technologist', 'director']);
    expect(el.querySelector('[data-testid="welcome"]')?.textContent).toBe('Welcome, Lee Lead');
    const duties = el.querySelector('[data-testid="duties"]')?.textContent ?? '';
    expect(duties).toContain('Technologist');
    expect(duties).toContain('signs them electronically');
    expect(duties).not.toContain('Administrator');
  });

  it('links only the pages the roles open, not this one', async () => {
    const el = await render(['admin']);
    const links = [...el.querySelectorAll('[data-testid^="open-"]')].map((a) => a.getAttribute('href'));
    expect(links).toEqual(navigationFor(['admin']).map((item) => item.path).filter((path) => path !== '/'));
    expect(links).toEqual(expect.arrayContaining(['/profile', '/admin/users', '/admin/analytes', '/admin/instruments', '/admin/mailbox']));
  });

  it('gives a quality officer no admin pages', async () => {
    const el = await render(['quality']);
    const links = [...el.querySelectorAll('[data-testid^="open-"]')].map((a) => a.getAttribute('href'));
    expect(links).toContain('/profile');
    expect(links.filter((href) => href?.startsWith('/admin'))).toEqual([]);
  });
});
