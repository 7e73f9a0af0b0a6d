import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, provideRouter } from '@angular/router';
import type { Role } from '@shared/schemas';
import { httpController, noAnimations, provideTestHttp } from '../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../testing/session-users';
import { AuthStore } from '../../auth/auth-store';
import { Notices } from '../../notify/notices';
import { navigationFor } from '../navigation';
import { Shell } from './shell';

async function setUp(roles: Role[]) {
  TestBed.configureTestingModule({
    providers: [...provideTestHttp(), provideRouter([]), provideSession(sessionUser(roles, 'Lee Lead')), noAnimations],
  });
  await restoreSession();
  const fixture = TestBed.createComponent(Shell);
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const navIds = () => [...el.querySelectorAll('[data-testid^="nav-"]')].map((a) => a.getAttribute('data-testid'));
  return { fixture, el, navIds };
}

describe('Shell', () => {
  afterEach(() => httpController().verify());

  it('shows the laboratory, the user and their roles in the toolbar', async () => {
    const { el } = await setUp(['technologist', 'director']);
    expect(el.querySelector('[data-testid="lab-name"]')?.textContent).toBe('Vale Harbor Regional Laboratory');
    expect(el.querySelector('[data-testid="user-name"]')?.textContent).toBe('Lee Lead');
    expect(el.querySelector('[data-testid="user-roles"]')?.textContent).toBe('Technologist, Laboratory director');
  });

  it('shows exactly the navigation entries the roles allow', async () => {
    const { navIds } = await setUp(['technologist', 'director']);
    expect(navIds()).toEqual(navigationFor(['technologist', 'director']).map((item) => `nav-${item.id}`));
  });

  it('offers an administrator the admin pages, under their heading', async () => {
    const { el, navIds } = await setUp(['admin']);
    expect(navIds()).toEqual(expect.arrayContaining(['nav-worklist', 'nav-profile', 'nav-users', 'nav-analytes', 'nav-instruments', 'nav-mailbox']));
    expect(el.querySelector('nav')?.textContent).toContain('Admin');
    expect(el.querySelector('[data-testid="nav-users"]')?.getAttribute('href')).toBe('/admin/users');
  });

  it('offers a quality officer no admin pages', async () => {
    const { el, navIds } = await setUp(['quality']);
    expect(navIds()).toEqual(expect.arrayContaining(['nav-worklist', 'nav-profile']));
    expect(navIds()).not.toEqual(expect.arrayContaining(['nav-users']));
    expect(navIds()).not.toEqual(expect.arrayContaining(['nav-mailbox']));
    expect(el.querySelector('nav')?.textContent).not.toContain('Admin');
  });

  it('signs out with DELETE /api/v1/session and goes to the sign-in page', async () => {
    const { el } = await setUp(['admin']);
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    (el.querySelector('[data-testid="sign-out"]') as HTMLButtonElement).click();
    httpController().expectOne({ method: 'DELETE', url: '/api/v1/session' }).flush(null, { status: 204, statusText: 'No Content' });
    expect(TestBed.inject(AuthStore).signedIn()).toBe(false);
    expect(navigate).toHaveBeenCalledWith('/sign-in');
    expect(TestBed.inject(Notices).message()).toBe('You are signed out.');
  });

  it('closes the snack bar the last session left open ("You are signed out.") when the next session starts', async () => {
    TestBed.configureTestingModule({
      providers: [...provideTestHttp(), provideRouter([]), provideSession(sessionUser(['admin'], 'Lee Lead')), noAnimations],
    });
    await restoreSession();
    TestBed.inject(MatSnackBar).open('You are signed out.', 'Close', { duration: 6000 });
    expect(document.querySelector('mat-snack-bar-container')?.textContent).toContain('You are signed out.');
    const fixture = TestBed.createComponent(Shell);
    await fixture.whenStable();
    expect(document.querySelector('mat-snack-bar-container')).toBeNull();
  });

  it('shows a posted notice in a snack bar', async () => {
    const { fixture } = await setUp(['admin']);
    TestBed.inject(Notices).post('Analyte saved.');
    await fixture.whenStable();
    expect(document.querySelector('mat-snack-bar-container')?.textContent).toContain('Analyte saved.');
  });
});
