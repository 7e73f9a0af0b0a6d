import { TestBed } from '@angular/core/testing';
import type { Role, Study } from '@shared/schemas';
import { apiError, httpController, noAnimations, provideTestHttp } from '../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../testing/session-users';
import { doneAnalysis, glucoseFindings, glucoseStudy, historyEvent, signature, specimensAnswer } from '../../../../testing/engine-findings';
import { CAUTION } from '@shared/text/caution';
import { StudySettings } from '@shared/schemas';
import { shortenedRange } from '../../studies/kinds/reportable-range/findings/range-results.testing';
import { ReviewPage } from './review-page';

/** What the engine concludes for the 40 invented glucose pairs (fixed rows and seed; see testing/engine-findings.ts). */
const CONCLUSION =
  'Within the allowable bias at 4.0 and 10.0 mmol/L; exceeds it at 20.0 mmol/L. ' +
  'Judged on the 95% CI of the bias that the Passing–Bablok regression of 40 pairs predicts at each level.';

/** An element's words, without its icons' ligatures. */
function words(element: Element): string {
  const copy = element.cloneNode(true) as Element;
  copy.querySelectorAll('mat-icon').forEach((icon) => icon.remove());
  return copy.textContent!.replace(/\s+/g, ' ').trim();
}

interface Answers {
  study?: Study;
  signatures?: ReturnType<typeof signature>[];
  history?: ReturnType<typeof historyEvent>[];
  analysisPatch?: Parameters<typeof doneAnalysis>[1];
}

/** The review page of study 12, answered as the API answers: the study, then its rows, signatures, history and analysis. */
async function mount(roles: Role[], answers: Answers = {}) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, ...provideSession(sessionUser(roles))] });
  await restoreSession();
  const fixture = TestBed.createComponent(ReviewPage);
  fixture.componentRef.setInput('id', '12');
  await fixture.whenStable();
  const { rows, results } = glucoseFindings();
  const study = answers.study ?? glucoseStudy({ state: 'awaiting-signoff', mayISign: { allowed: true, why: 'You may sign: you entered none of its rows.' } });
  httpController().expectOne('/api/v1/studies/12').flush(study);
  await fixture.whenStable();
  httpController().expectOne('/api/v1/studies/12/specimens').flush(specimensAnswer(rows));
  httpController().expectOne('/api/v1/studies/12/signatures').flush(answers.signatures ?? []);
  httpController().match('/api/v1/studies/12/history').forEach((r) => r.flush(answers.history ?? []));
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const text = (id: string) => { const found = el.querySelector(`[data-testid="${id}"]`); return found ? words(found) : null; };
  const banners = () => Array.from(el.querySelectorAll('[data-testid="banner"]')).map(words);
  /** Answers the analysis request, if the page asked for one. */
  const analysis = async (id: number, patch = answers.analysisPatch ?? {}) => {
    httpController().expectOne(`/api/v1/analyses/${id}`).flush(doneAnalysis(results, { id, ...patch }));
    await fixture.whenStable();
  };
  return { fixture, el, text, banners, analysis, results };
}

describe('ReviewPage', () => {
  // jsdom has no canvas: chart.js gets no context and draws nothing, which these tests do not read.
  beforeEach(() => jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null));
  afterEach(() => {
    httpController().verify();
    jest.restoreAllMocks();
  });

  it('shows a director the engine’s verdict, the caution, the analysis read and both steps of a study awaiting their signature', async () => {
    const { el, text, analysis, results } = await mount(['director']);
    await analysis(8);
    expect(text('review-title')).toBe('Glucose: line 2 against line 1');
    expect(text('review-state')).toBe('Awaiting sign-off');
    expect(text('who-may-sign')).toBe('You may sign: you entered none of its rows.');
    expect(el.querySelector('[data-testid="open-return"]')).not.toBeNull();
    expect(el.querySelector('[data-testid="open-sign"]')).not.toBeNull();
    expect(text('verdict-overall')).toBe(CONCLUSION);
    expect(text('review-caution')).toBe(`Caution. ${CAUTION}`);
    expect(text('review-analysis')).toBe(`Analysis 8 · engine ${results.engine.version} · seed h8-component-tests · 1,000 resamples`);
    // The engine flags row 17 (G17, read 2 mmol/L high); the review lists it and offers no exclusion.
    expect(Array.from(el.querySelectorAll('[data-testid="outliers"] tbody tr')).map((tr) => Array.from(tr.children).map(words))).toEqual([
      ['17', 'G17', '10.8', '13.2', ''],
    ]);
    expect(el.querySelector('[data-testid="exclude-17"]')).toBeNull();
    expect(el.querySelector('[data-testid="moved-alert"]')).toBeNull();
  });

  it('lets a director who may not sign return the study, not sign it, and says why', async () => {
    const study = glucoseStudy({ state: 'awaiting-signoff', mayISign: { allowed: false, why: 'You entered rows of this study; another director signs it.' } });
    const { el, text, analysis } = await mount(['director'], { study });
    await analysis(8);
    expect(text('who-may-sign')).toBe('You entered rows of this study; another director signs it.');
    expect(el.querySelector('[data-testid="open-return"]')).not.toBeNull();
    expect(el.querySelector('[data-testid="open-sign"]')).toBeNull();
  });

  it('offers a technologist no step on a study awaiting sign-off', async () => {
    const study = glucoseStudy({ state: 'awaiting-signoff', mayISign: { allowed: false, why: 'A director of the laboratory signs it.' } });
    const { el, text, analysis } = await mount(['technologist'], { study });
    await analysis(8);
    expect(text('who-may-sign')).toBe('A director of the laboratory signs it.');
    expect(el.querySelector('[data-testid="open-return"]')).toBeNull();
    expect(el.querySelector('[data-testid="open-sign"]')).toBeNull();
  });

  it('shows the analysis the signature was made on, not the latest, with the signature in place of the steps', async () => {
    const study = glucoseStudy({ state: 'signed', latestAnalysisId: 9, currentAnalysisId: 9 });
    const { el, text, analysis } = await mount(['director'], { study, signatures: [signature({ analysisId: 6 })] });
    await analysis(6);
    expect(text('review-analysis')).toMatch(/^Analysis 6 · /);
    expect(el.querySelector('[data-testid="signature-block"]')).not.toBeNull();
    expect(el.querySelector('[data-testid="open-sign"]')).toBeNull();
    expect(el.querySelector('[data-testid="open-return"]')).toBeNull();
  });

  it('counts the criteria moved after plan approval from the history', async () => {
    const moved = [
      historyEvent({ id: 91, action: 'study.plan-amended', headline: 'Allowable bias changed after plan approval' }),
      historyEvent({ id: 92, action: 'study.plan-amended', headline: 'Decision levels changed after plan approval' }),
      historyEvent({ id: 93, action: 'specimens.saved', headline: 'Rows saved' }),
    ];
    const { text, analysis } = await mount(['director'], { history: moved });
    await analysis(8);
    expect(text('moved-alert')).toBe('2 criterion changes after the plan was approved. Read what moved, when, by whom and why.');
  });

  it('refuses to let stale findings pass for current ones', async () => {
    const { banners, text, analysis } = await mount(['director'], { analysisPatch: { current: false } });
    await analysis(8);
    expect(banners()).toContain("These findings do not describe the study's rows and settings as they stand; it cannot be signed until it is analysed again.");
    expect(text('verdict-overall')).toBe(CONCLUSION);
  });

  it('says so when no analysis has been run', async () => {
    const study = glucoseStudy({ state: 'draft', latestAnalysisId: null, currentAnalysisId: null, returnComment: 'Add five specimens above 20 mmol/L' });
    const { el, text } = await mount(['director'], { study });
    httpController().expectNone('/api/v1/analyses/8');
    expect(text('no-findings')).toBe('No analysis has been run for this study.');
    expect(el.querySelector('[data-testid="verdict-panel"]')).toBeNull();
    expect(el.textContent).toContain('A draft, not submitted for sign-off. Returned with the comment: “Add five specimens above 20 mmol/L”');
    expect(text('review-caution')).toContain('Decision support only.');
  });

  it('names the failure when the signatures cannot be read, and shows no findings it did not read', async () => {
    TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, ...provideSession(sessionUser(['director']))] });
    await restoreSession();
    const fixture = TestBed.createComponent(ReviewPage);
    fixture.componentRef.setInput('id', '12');
    await fixture.whenStable();
    httpController().expectOne('/api/v1/studies/12').flush(glucoseStudy({ state: 'awaiting-signoff' }));
    await fixture.whenStable();
    httpController().expectOne('/api/v1/studies/12/specimens').flush(specimensAnswer(glucoseFindings().rows));
    httpController().expectOne('/api/v1/studies/12/signatures').flush(apiError('The database is not answering; try again in a moment'), { status: 503, statusText: 'Unavailable' });
    // The review's own read of the history was cancelled with the signatures; the history panel's read goes on.
    httpController().match('/api/v1/studies/12/history').filter((r) => !r.cancelled).forEach((r) => r.flush([]));
    await fixture.whenStable();
    httpController().expectNone('/api/v1/analyses/8');
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('[data-testid="banner"]')?.textContent).toContain('Part of the review could not be read: The database is not answering; try again in a moment');
    expect(el.querySelector('[data-testid="verdict-panel"]')).toBeNull();
  });

  it('shows a kind with its own Findings panel through that panel, on the engine’s results', async () => {
    const results = shortenedRange();
    const study = glucoseStudy({
      kind: 'reportable-range', title: 'Glucose: reportable range of line 2', state: 'awaiting-signoff', mayISign: { allowed: true, why: 'You may sign it.' },
      settings: { ...StudySettings.parse({ unit: 'mmol/L', decimals: 1 }), nonlinearitySource: 'Laboratory linearity goal (invented)' } as Study['settings'],
    });
    TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, ...provideSession(sessionUser(['director']))] });
    await restoreSession();
    const fixture = TestBed.createComponent(ReviewPage);
    fixture.componentRef.setInput('id', '12');
    await fixture.whenStable();
    httpController().expectOne('/api/v1/studies/12').flush(study);
    await fixture.whenStable();
    httpController().expectOne('/api/v1/studies/12/specimens').flush(specimensAnswer([]));
    httpController().expectOne('/api/v1/studies/12/signatures').flush([]);
    httpController().match('/api/v1/studies/12/history').forEach((r) => r.flush([]));
    await fixture.whenStable();
    httpController().expectOne('/api/v1/analyses/8').flush(doneAnalysis(results));
    await fixture.whenStable();
    await new Promise((resolve) => setTimeout(resolve, 50));
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(words(el.querySelector('[data-testid="range-verdict"]')!)).toBe('Reportable range shortened');
    expect(el.querySelector('[data-testid="verdict-panel"]')).toBeNull();
    expect(words(el.querySelector('[data-testid="review-analysis"]')!)).toBe(`Analysis 8 · engine ${results.engine.version} · seed client-spec · 1,000 resamples`);
    expect(words(el.querySelector('[data-testid="review-caution"]')!)).toBe(`Caution. ${CAUTION}`);
  });

  it('names the failure when the study itself cannot be read', async () => {
    TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, ...provideSession(sessionUser(['director']))] });
    await restoreSession();
    const fixture = TestBed.createComponent(ReviewPage);
    fixture.componentRef.setInput('id', '77');
    await fixture.whenStable();
    httpController().expectOne('/api/v1/studies/77').flush(apiError('Study 77 was not found'), { status: 404, statusText: 'Not Found' });
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('[data-testid="banner"]')?.textContent).toContain('Study 77 was not found');
    expect(el.querySelector('[data-testid="review-title"]')).toBeNull();
  });

  it('returns the study with the director’s comment and reads its signatures and history again', async () => {
    const { fixture, el, text, analysis } = await mount(['director']);
    await analysis(8);
    (el.querySelector('[data-testid="open-return"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    const field = document.querySelector('mat-dialog-container [data-testid="reason-text"]') as HTMLTextAreaElement;
    field.value = 'Explain the exclusion of row 17';
    field.dispatchEvent(new Event('input'));
    (document.querySelector('mat-dialog-container [data-testid="reason-confirm"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/studies/12/return' });
    expect(req.request.body).toEqual({ comment: 'Explain the exclusion of row 17' });
    req.flush(glucoseStudy({ state: 'draft', version: 5, returnComment: 'Explain the exclusion of row 17' }));
    await fixture.whenStable();
    httpController().expectOne('/api/v1/studies/12/signatures').flush([]);
    httpController().match('/api/v1/studies/12/history').forEach((r) => r.flush([]));
    await fixture.whenStable();
    await analysis(8);
    expect(text('review-state')).toBe('Draft');
    expect(el.querySelector('[data-testid="open-sign"]')).toBeNull();
    expect(el.textContent).toContain('Returned with the comment: “Explain the exclusion of row 17”');
  });
});
