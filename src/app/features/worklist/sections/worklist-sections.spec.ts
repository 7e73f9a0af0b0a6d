import { TestBed } from '@angular/core/testing';
import type { Role, StudySummary, Worklist } from '@shared/schemas';
import { httpController, provideTestHttp } from '../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../testing/session-users';
import { WorklistSections } from './worklist-sections';

const study = (id: number, title: string): StudySummary => ({
  id, kind: 'method-comparison', title, analyte: { id: 1, name: 'Glucose' }, instruments: 'Chemistry line 1 → Chemistry line 2',
  n: 40, state: 'draft', superseded: false, findings: 'current', updatedAt: '2026-03-02T09:30:00Z', createdBy: { id: 7, name: 'Ada Tester' },
});

async function render(roles: Role[], worklist: Worklist): Promise<HTMLElement> {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), provideSession(sessionUser(roles))] });
  await restoreSession();
  const fixture = TestBed.createComponent(WorklistSections);
  fixture.detectChanges();
  httpController().expectOne('/api/v1/worklist').flush(worklist);
  await fixture.whenStable();
  return fixture.nativeElement as HTMLElement;
}

const empty: Worklist = { drafts: [], returned: [], awaitingSignature: [], recentlySigned: [] };
const sectionIds = (el: HTMLElement) => [...el.querySelectorAll('section')].map((s) => s.getAttribute('data-testid'));

describe('WorklistSections', () => {
  it("lists a technologist's returned studies and drafts, each linking to its study", async () => {
    const el = await render(['technologist'], { ...empty, drafts: [study(4, 'Glucose on line 2')] });
    expect(sectionIds(el)).toEqual(['wl-returned', 'wl-drafts', 'wl-recentlySigned']);
    const row = el.querySelector('[data-testid="wl-study-4"]')!;
    expect(row.textContent).toContain('Glucose on line 2');
    expect(row.textContent).toContain('Chemistry line 1 → Chemistry line 2');
    expect(row.querySelector('a')?.getAttribute('href')).toBe('/studies/4');
    expect(row.textContent).toContain('2026-03-02 09:30');
    expect(el.querySelector('[data-testid="wl-drafts"] thead')?.textContent).toContain('Last change (Europe/Lisbon)');
    expect(el.querySelector('[data-testid="worklist-new"]')).not.toBeNull();
  });

  it('gives a director the studies awaiting their signature, each linking to its review', async () => {
    const el = await render(['director'], { ...empty, awaitingSignature: [study(9, 'Creatinine, new lot')] });
    expect(sectionIds(el)).toContain('wl-awaitingSignature');
    expect(el.querySelector('[data-testid="wl-awaitingSignature"]')?.textContent).toContain('Creatinine, new lot');
    expect(el.querySelector('[data-testid="wl-study-9"] a')?.getAttribute('href')).toBe('/studies/9/review');
  });

  it('shows a quality officer only what was signed, and no New study button', async () => {
    const el = await render(['quality'], empty);
    expect(sectionIds(el)).toEqual(['wl-recentlySigned']);
    expect(el.textContent).toContain('No study has been signed recently.');
    expect(el.querySelector('[data-testid="worklist-new"]')).toBeNull();
  });
});
