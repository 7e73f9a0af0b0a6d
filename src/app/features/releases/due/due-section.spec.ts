import { TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import type { Role } from '@shared/schemas';
import { laboratoryDate } from '@shared/types/lab-time';
import { apiError, httpController, noAnimations, provideTestHttp } from '../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../testing/session-users';
import { dueItem, templates } from '../release-fixtures.testing';
import { DueSection } from './due-section';

const pause = (ms = 0) => new Promise((resolve) => setTimeout(resolve, ms));
/** A day counted from the laboratory's today (sessionUser's laboratory keeps Europe/Lisbon time). */
const day = (offset: number): string => {
  const today = laboratoryDate(new Date(), 'Europe/Lisbon');
  const at = new Date(`${today}T00:00:00Z`);
  at.setUTCDate(at.getUTCDate() + offset);
  return at.toISOString().slice(0, 10);
};

async function open(roles: Role[]) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, ...provideSession(sessionUser(roles))] });
  await restoreSession();
  const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
  const fixture = TestBed.createComponent(DueSection);
  await fixture.whenStable();
  const req = httpController().expectOne((r) => r.url === '/api/v1/due');
  expect(req.request.params.get('status')).toBe('pending');
  req.flush([
    dueItem({ id: 14, label: 'Half-yearly precision', status: 'due-soon', dueDate: day(20), daysLeft: 20, dueWords: 'due in 20 days' }),
    dueItem({ id: 16, label: 'Interval review', status: 'due-soon', dueDate: day(25), kinds: ['interval-verify'] }),
    dueItem({ id: 15, label: 'Lot check', status: 'later', dueDate: day(90) }),
    dueItem({ id: 12, label: 'Yearly comparison', status: 'overdue', dueDate: day(-12), daysLeft: -12, dueWords: 'overdue by 12 days' }),
  ]);
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const q = (id: string) => document.querySelector(`[data-testid="${id}"]`) as HTMLElement | null;
  const click = async (target: HTMLElement | null) => {
    expect(target).not.toBeNull();
    target!.click();
    await fixture.whenStable();
    await pause();
    await fixture.whenStable();
  };
  return { fixture, el, q, click, navigate };
}

describe('DueSection', () => {
  afterEach(() => {
    httpController().verify();
    document.querySelectorAll('.cdk-overlay-container').forEach((c) => (c.innerHTML = ''));
  });

  it('lists overdue items first, then those due soon, each with its date in words and the release that set it', async () => {
    const { el, q } = await open(['quality']);
    const items = [...el.querySelectorAll('[data-testid="due-item"]')];
    expect(items.map((i) => i.getAttribute('data-due-id'))).toEqual(['12', '14', '16']);
    expect(q('due-words-12')?.textContent).toBe('overdue by 12 days');
    expect(q('due-words-14')?.textContent).toBe('due in 20 days');
    expect(items[0].getAttribute('data-status')).toBe('overdue');
    expect(items[0].querySelector('mat-icon')?.textContent).toBe('event_busy');
    expect(q('due-release-12')?.getAttribute('href')).toBe('/releases/7');
    expect(q('due-release-12')?.textContent).toBe('Glucose on chemistry line 2');
    expect(el.textContent).not.toContain('Lot check');
  });

  it('gives the quality officer no actions', async () => {
    const { q } = await open(['quality']);
    expect(q('due-start-study-12')).toBeNull();
    expect(q('due-start-release-12')).toBeNull();
  });

  it('starts a study of the chosen kind from an item and opens its Setup', async () => {
    const { q, click, navigate, fixture } = await open(['technologist']);
    await click(q('due-start-study-12'));
    await click(q('due-start-study-12-kind-method-comparison'));
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/due/12/start' });
    expect(req.request.body).toEqual({ kind: 'method-comparison' });
    req.flush(dueItem({ id: 12, state: 'started', status: 'started', startedStudy: { id: 80, name: 'Yearly comparison: Glucose' } }));
    await fixture.whenStable();
    expect(navigate).toHaveBeenCalledWith(['/studies', 80, 'setup']);
  });

  it('starts the one kind a rule names with one click', async () => {
    const { q, click } = await open(['technologist']);
    expect(q('due-start-study-16-kind-precision')).toBeNull();
    await click(q('due-start-study-16'));
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/due/16/start' });
    expect(req.request.body).toEqual({ kind: 'interval-verify' });
    req.flush(dueItem({ id: 16, state: 'started', status: 'started', startedStudy: { id: 81, name: 'Interval review' } }));
  });

  it('says so when a study cannot be started', async () => {
    const { q, click, fixture, navigate } = await open(['director']);
    await click(q('due-start-study-14'));
    await click(q('due-start-study-14-kind-precision'));
    httpController().expectOne('/api/v1/due/14/start').flush(apiError('A study was already started from this item'), { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(q('banner')?.textContent).toContain('A study was already started from this item');
    expect(navigate).not.toHaveBeenCalled();
  });

  it('opens a new release filled in from the item', async () => {
    const { q, click, fixture } = await open(['director']);
    await click(q('due-start-release-12'));
    await pause(10);
    await fixture.whenStable();
    httpController().expectOne('/api/v1/analytes').flush([{ id: 3, name: 'Glucose', unit: 'mmol/L', active: true }]);
    httpController().expectOne('/api/v1/instruments').flush([{ id: 5, name: 'Chemistry line 2', active: true }]);
    httpController().expectOne('/api/v1/release-templates').flush(templates());
    await fixture.whenStable();
    expect(q('create-from-due')?.textContent).toContain('Yearly comparison');
    expect((q('create-title') as HTMLInputElement).value).toBe('Yearly comparison: Glucose on Chemistry line 2');
    expect(q('create-analyte')?.textContent).toContain('Glucose');
  });
});
