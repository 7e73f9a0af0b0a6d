import { TestBed } from '@angular/core/testing';
import { StudySettings, type Study } from '@shared/schemas';
import { apiError, httpController, noAnimations, provideTestHttp } from '../../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../../testing/session-users';
import type { Role } from '@shared/schemas';
import { StudyStore } from '../study-store';
import { SignoffBar } from './signoff-bar';

function study(patch: Partial<Study> = {}): Study {
  return {
    id: 12, kind: 'method-comparison', title: 'Glucose: line 2 against line 1', analyte: { id: 1, name: 'Glucose' }, instruments: 'Line 1 → Line 2',
    n: 40, state: 'draft', superseded: false, findings: 'current', updatedAt: '2026-11-30T10:00:00.000Z', createdBy: { id: 3, name: 'Tomas Reyes' },
    purpose: '', analyteUnit: 'mmol/L', comparativeInstrument: null, candidateInstrument: null, instrument: null, settings: StudySettings.parse({}),
    version: 4, supersedesId: null, supersededById: null, latestAnalysisId: 8, currentAnalysisId: 8, canBeNegative: false,
    createdAt: '2026-11-29T10:00:00.000Z', returnComment: null, submissionNote: null, release: null, ...patch,
  };
}

async function mount(roles: Role[], shown: Study) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, ...provideSession(sessionUser(roles)), StudyStore] });
  await restoreSession();
  const store = TestBed.inject(StudyStore);
  store.adopt(shown);
  const fixture = TestBed.createComponent(SignoffBar);
  await fixture.whenStable();
  httpController().expectOne(`/api/v1/studies/${shown.id}/signatures`).flush([]);
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const text = (id: string) => el.querySelector(`[data-testid="${id}"]`)?.textContent?.trim() ?? '';
  const button = (id: string) => el.querySelector(`[data-testid="${id}"]`) as HTMLButtonElement | null;
  return { fixture, el, store, text, button };
}

/** The text of an element of the open dialog (rendered in the overlay, outside the component). */
const inDialog = (selector: string) => document.querySelector(`mat-dialog-container ${selector}`)?.textContent?.trim() ?? null;

/** Opens the submission dialog, types the note and confirms it. */
async function submitWith(fixture: { whenStable: () => Promise<unknown> }, button: (id: string) => HTMLButtonElement | null, note: string) {
  button('step-submit')!.click();
  await fixture.whenStable();
  const field = document.querySelector('[data-testid="submit-note"]') as HTMLTextAreaElement;
  field.value = note;
  field.dispatchEvent(new Event('input'));
  (document.querySelector('[data-testid="submit-confirm"]') as HTMLButtonElement).click();
  await fixture.whenStable();
}

describe('SignoffBar', () => {
  afterEach(() => httpController().verify());

  it('asks first, saying the study is locked for the director; Cancel sends nothing', async () => {
    const { fixture, button } = await mount(['technologist'], study());
    button('step-submit')!.click();
    await fixture.whenStable();
    expect(inDialog('h2')).toBe('Submit for sign-off');
    expect(inDialog('[data-testid="submit-what"]')).toMatch(/^Submitting locks the study for the director: its rows and settings cannot change while a director reviews it\./);
    (document.querySelector('mat-dialog-actions button[mat-dialog-close]') as HTMLButtonElement).click();
    await fixture.whenStable();
    httpController().expectNone('/api/v1/studies/12/submit');
  });

  it('submits a draft with the trimmed note for the director and follows the study the server answers', async () => {
    const { fixture, store, text, button } = await mount(['technologist'], study());
    expect(text('signoff-state')).toBe('Draft');
    await submitWith(fixture, button, '  Rows 12 and 31 were run again.  ');
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/studies/12/submit' });
    expect(req.request.body).toEqual({ note: 'Rows 12 and 31 were run again.' });
    req.flush(study({ state: 'awaiting-signoff', version: 5 }));
    await fixture.whenStable();
    httpController().expectOne('/api/v1/studies/12/signatures').flush([]);
    await fixture.whenStable();
    expect(store.study()?.state).toBe('awaiting-signoff');
    expect(text('signoff-state')).toBe('Awaiting the director’s signature');
    expect(button('step-submit')).toBeNull();
  });

  it('shows every issue of a refused submission in words', async () => {
    const { fixture, el, button } = await mount(['technologist'], study());
    await submitWith(fixture, button, '');
    httpController().expectOne('/api/v1/studies/12/submit').flush(
      apiError('The study cannot be submitted yet: Name at least one medical decision level; Name the source of the allowable bias', [
        { path: 'settings.decisionLevels', message: 'Name at least one medical decision level' },
        { path: 'settings.allowableBiasSource', message: 'Name the source of the allowable bias' },
      ]),
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    const refusal = el.querySelector('[data-testid="submit-refusal"]')!;
    expect(refusal.querySelector('p')?.textContent).toBe('The study cannot be submitted yet:');
    expect([...refusal.querySelectorAll('li')].map((li) => li.textContent)).toEqual([
      'Name at least one medical decision level', 'Name the source of the allowable bias',
    ]);
  });

  it('disables the submission with its reason while the findings are out of date, and shows the return comment', async () => {
    const { button, text } = await mount(['technologist'], study({ findings: 'out-of-date', returnComment: 'Explain the exclusion of row 7' }));
    expect(button('step-submit')!.disabled).toBe(true);
    expect(text('blocked-submit')).toContain('The findings are out of date');
    expect(text('signoff-state')).toBe('Draft, returned by the director');
    expect(text('return-comment')).toContain('Explain the exclusion of row 7');
  });

  it('offers a director the review of a study awaiting sign-off, and quality only the words', async () => {
    const director = await mount(['director'], study({ state: 'awaiting-signoff' }));
    expect(director.button('step-open-review')).not.toBeNull();
    TestBed.resetTestingModule();
    const quality = await mount(['quality'], study({ state: 'awaiting-signoff' }));
    expect(quality.el.querySelectorAll('button')).toHaveLength(0);
    expect(quality.text('signoff-state')).toBe('Awaiting the director’s signature');
  });

  it('links a superseded study to the one that replaces it and offers no amendment', async () => {
    const { el, text, button } = await mount(['director'], study({ state: 'signed', supersededById: 31 }));
    expect(text('superseded-by')).toMatch(/Superseded by study 31\.$/);
    expect(el.querySelector('[data-testid="superseded-by"] a')?.getAttribute('href')).toBe('/studies/31');
    expect(button('step-amend')).toBeNull();
  });
});
