import { TestBed } from '@angular/core/testing';
import type { Role, Study } from '@shared/schemas';
import { apiError, httpController, noAnimations, provideTestHttp } from '../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../testing/session-users';
import { glucoseStudy } from '../../../../testing/engine-findings';
import { StudyPage } from './study-page';

/** The study page of study 12 for a user with these roles, with GET /studies/12 answered by `study` (or an error). */
async function mount(roles: Role[], answer: Study | { status: number; body: ReturnType<typeof apiError> }) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, ...provideSession(sessionUser(roles))] });
  await restoreSession();
  const fixture = TestBed.createComponent(StudyPage);
  fixture.componentRef.setInput('id', '12');
  await fixture.whenStable();
  const req = httpController().expectOne('/api/v1/studies/12');
  if ('status' in answer) req.flush(answer.body, { status: answer.status, statusText: 'Error' });
  else req.flush(answer);
  await fixture.whenStable();
  // The sign-off bar reads the study's signatures once the study is there.
  httpController().match('/api/v1/studies/12/signatures').forEach((r) => r.flush([]));
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const text = (id: string) => el.querySelector(`[data-testid="${id}"]`)?.textContent?.replace(/\s+/g, ' ').trim() ?? null;
  const banners = () => Array.from(el.querySelectorAll('[data-testid="banner"] span')).map((s) => s.textContent!.trim());
  return { fixture, el, text, banners };
}

describe('StudyPage', () => {
  afterEach(() => httpController().verify());

  it('heads the study with its title, n, state and findings state, and links its four sections', async () => {
    const { el, text } = await mount(['technologist'], glucoseStudy({ n: 38, findings: 'out-of-date' }));
    expect(text('study-title')).toBe('Glucose: line 2 against line 1');
    expect(text('study-n')).toBe('n = 38');
    expect(text('study-state')).toBe('Draft');
    expect(text('study-findings')).toBe('Findings out of date');
    expect(el.querySelector('p.kind')?.textContent?.trim()).toBe('Method comparison');
    expect(Array.from(el.querySelectorAll('[data-testid^="tab-"]')).map((a) => [a.getAttribute('data-testid'), a.getAttribute('href')])).toEqual([
      ['tab-setup', '/setup'], ['tab-specimens', '/specimens'], ['tab-findings', '/findings'], ['tab-history', '/history'],
    ]);
    expect(el.querySelector('[data-testid="read-only"]')).toBeNull();
  });

  it('tells a reader without an entering role that they may read the draft, not change it', async () => {
    const { text } = await mount(['quality'], glucoseStudy());
    expect(text('read-only')).toBe('lock Your roles let you read this study, not change it.');
  });

  it('says a study awaiting sign-off or signed no longer changes, even for the roles that enter studies', async () => {
    const waiting = await mount(['technologist', 'director'], glucoseStudy({ state: 'awaiting-signoff' }));
    expect(waiting.text('read-only')).toBe('lock This study is awaiting sign-off; its rows and settings no longer change.');
    TestBed.resetTestingModule();
    const signed = await mount(['technologist'], glucoseStudy({ state: 'signed', findings: 'current' }));
    expect(signed.text('read-only')).toBe('lock This study is signed; its rows and settings no longer change.');
    expect(signed.text('study-state')).toBe('Signed');
  });

  it('says in words that it cannot show a kind it has no view for, and offers no sections', async () => {
    const { el, banners } = await mount(['technologist'], glucoseStudy({ kind: 'carry-over' as Study['kind'] }));
    expect(banners()).toEqual(['Parallax cannot show this kind of study yet.']);
    expect(el.querySelectorAll('[data-testid^="tab-"]')).toHaveLength(0);
  });

  it('names the error when the study cannot be read, and shows no heading', async () => {
    const { el, banners } = await mount(['technologist'], { status: 404, body: apiError('Study 12 was not found') });
    expect(banners()).toEqual(['Study 12 was not found']);
    expect(el.querySelector('[data-testid="study-title"]')).toBeNull();
  });
});
