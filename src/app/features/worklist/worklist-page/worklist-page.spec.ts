import { TestBed } from '@angular/core/testing';
import type { Role } from '@shared/schemas';
import { laboratoryDate } from '@shared/types/lab-time';
import { httpController, provideTestHttp } from '../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../testing/session-users';
import { navigationFor } from '../../../core/layout/navigation';
import { dueItem } from '../../releases/release-fixtures.testing';
import { WorklistPage } from './worklist-page';

const EMPTY_WORKLIST = { drafts: [], returned: [], awaitingSignature: [], recentlySigned: [] };

let dueRequests = 0;

async function render(roles: Role[], due = [dueItem()]) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), provideSession(sessionUser(roles, 'Lee Lead'))] });
  await restoreSession();
  const fixture = TestBed.createComponent(WorklistPage);
  await fixture.whenStable();
  httpController().match('/api/v1/worklist').forEach((r) => r.flush(EMPTY_WORKLIST));
  const dueAsked = httpController().match((r) => r.url === '/api/v1/due');
  dueAsked.forEach((r) => r.flush(due));
  await fixture.whenStable();
  dueRequests = dueAsked.length;
  return fixture.nativeElement as HTMLElement;
}

describe('WorklistPage', () => {
  afterEach(() => httpController().verify());

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

  it('shows what is due for re-verification, with the date in words, to the roles that read studies', async () => {
    const today = laboratoryDate(new Date(), 'Europe/Lisbon');
    for (const roles of [['technologist'], ['director'], ['quality']] as Role[][]) {
      TestBed.resetTestingModule();
      const el = await render(roles, [dueItem({ id: 12, status: 'due-soon', dueDate: today, daysLeft: 0, dueWords: 'due today' })]);
      expect(dueRequests).toBe(1);
      expect(el.querySelector('[data-testid="wl-due"]')?.textContent).toContain('Yearly comparison');
      expect(el.querySelector('[data-testid="due-words-12"]')?.textContent).toBe('due today');
    }
  });

  it('shows an administrator no Due section and asks nothing of it', async () => {
    const el = await render(['admin']);
    expect(el.querySelector('[data-testid="wl-due"]')).toBeNull();
    expect(dueRequests).toBe(0);
  });
});
