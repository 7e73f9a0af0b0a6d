import { DeferBlockBehavior, TestBed } from '@angular/core/testing';
import type { Role, Study } from '@shared/schemas';
import { analyzeComparison } from '@shared/stats/analyze-comparison';
import { CAUTION } from '@shared/text/caution';
import { apiError, httpController, noAnimations, provideTestHttp } from '../../../../../testing/http';
import { withoutViewportEntries } from '../../../../../testing/never-intersecting';
import { provideSession, restoreSession, sessionUser } from '../../../../../testing/session-users';
import { doneAnalysis, glucoseFindings, glucoseStudy, specimensAnswer } from '../../../../../testing/engine-findings';
import { SpecimensStore } from '../../specimens/specimens-store';
import { StudyStore } from '../../study/study-store';
import { AnalysisStore, POLL_MS } from '../analysis-store';
import { FindingsTab } from './findings-tab';

/** What the engine concludes for the 40 invented glucose pairs (fixed rows and seed; see testing/engine-findings.ts). */
const CONCLUSION =
  'Within the allowable bias at 4.0 and 10.0 mmol/L; exceeds it at 20.0 mmol/L. ' +
  'Judged on the 95% CI of the bias that the Passing–Bablok regression of 40 pairs predicts at each level.';

const settle = async (fixture: { whenStable: () => Promise<unknown> }, ms = 0) => {
  await new Promise((resolve) => setTimeout(resolve, ms));
  await fixture.whenStable();
};

/** An element's words, without its icons' ligatures. */
function words(e: Element | null): string | null {
  if (!e) return null;
  const copy = e.cloneNode(true) as Element;
  copy.querySelectorAll('mat-icon').forEach((icon) => icon.remove());
  return copy.textContent!.replace(/\s+/g, ' ').trim();
}

/** The Findings tab of study 12 under the study page's stores; its rows are answered as the API answers them. */
async function mount(roles: Role[], study: Study) {
  TestBed.configureTestingModule({
    providers: [...provideTestHttp(), noAnimations, ...provideSession(sessionUser(roles)), StudyStore, SpecimensStore, AnalysisStore],
    // The plots wait in their @defer placeholder (jsdom has no IntersectionObserver); these tests read the words above them.
    deferBlockBehavior: DeferBlockBehavior.Manual,
  });
  await restoreSession();
  TestBed.inject(StudyStore).adopt(study);
  const fixture = TestBed.createComponent(FindingsTab);
  await fixture.whenStable();
  const { rows, results } = glucoseFindings();
  httpController().expectOne('/api/v1/studies/12/specimens').flush(specimensAnswer(rows));
  await settle(fixture);
  const el = fixture.nativeElement as HTMLElement;
  const text = (id: string) => words(el.querySelector(`[data-testid="${id}"]`));
  const button = (id: string) => el.querySelector(`[data-testid="${id}"]`) as HTMLButtonElement | null;
  const banners = () => Array.from(el.querySelectorAll('[data-testid="banner"]')).map(words);
  return { fixture, el, text, button, banners, results };
}

describe('FindingsTab', () => {
  withoutViewportEntries();
  // jsdom has no canvas: chart.js gets no context and draws nothing, which these tests do not read.
  beforeEach(() => jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null));
  afterEach(() => {
    httpController().verify();
    jest.restoreAllMocks();
  });

  it('shows the latest findings with their run line, the caution and the engine’s verdict', async () => {
    const { fixture, text, button, results } = await mount(['technologist'], glucoseStudy());
    httpController().expectOne('/api/v1/analyses/8').flush(doneAnalysis(results));
    await settle(fixture);
    httpController().expectOne('/api/v1/studies/12').flush(glucoseStudy());
    await settle(fixture);
    expect(text('run-state')).toBe(`Done in 3.2 s · engine ${results.engine.version} · seed h8-component-tests · 1,000 resamples`);
    expect(text('caution')).toBe(CAUTION);
    expect(text('verdict-overall')).toBe(CONCLUSION);
    expect(button('run-analysis')!.textContent!.trim()).toBe('play_arrow Run the analysis again');
    expect(button('run-analysis')!.disabled).toBe(false);
    expect(text('out-of-date')).toBeNull();
  });

  it('runs the analysis, follows its progress and shows the findings once it is done', async () => {
    const study = glucoseStudy({ latestAnalysisId: null, currentAnalysisId: null, findings: 'none' });
    const { fixture, text, button, results } = await mount(['technologist'], study);
    expect(text('no-findings')).toBe('No analysis has been run for this study yet. Enter the specimens, then run the analysis.');
    expect(button('run-analysis')!.textContent!.trim()).toBe('play_arrow Run the analysis');
    button('run-analysis')!.click();
    await settle(fixture);
    const queued = doneAnalysis(null, { id: 9, state: 'queued', progress: 0, results: null, startedAt: null, finishedAt: null, durationMs: null, queuedAt: new Date().toISOString() });
    httpController().expectOne({ method: 'POST', url: '/api/v1/studies/12/analyses' }).flush(queued);
    await settle(fixture);
    httpController().expectOne('/api/v1/analyses/9').flush({ ...queued, state: 'running', progress: 0.45, startedAt: new Date().toISOString() });
    await settle(fixture);
    expect(text('run-state')).toBe('Running · 45 % · 0 s');
    expect(button('run-analysis')!.disabled).toBe(true);
    await settle(fixture, POLL_MS + 50);
    httpController().expectOne('/api/v1/analyses/9').flush(doneAnalysis(results, { id: 9 }));
    await settle(fixture);
    httpController().expectOne('/api/v1/studies/12').flush(glucoseStudy({ latestAnalysisId: 9, currentAnalysisId: 9 }));
    await settle(fixture);
    expect(text('verdict-overall')).toBe(CONCLUSION);
    expect(text('no-findings')).toBeNull();
    expect(button('run-analysis')!.disabled).toBe(false);
  });

  it('names the engine’s failure and asks for the rows and settings to be checked', async () => {
    let engineError = '';
    try {
      analyzeComparison([{ x: 5.1, y: 5.2 }, { x: Number.NaN, y: 6.1 }, { x: 7.0, y: 7.2 }]);
    } catch (err) {
      engineError = (err as Error).message;
    }
    expect(engineError).not.toBe('');
    const { fixture, banners, el } = await mount(['technologist'], glucoseStudy({ findings: 'failed' }));
    httpController().expectOne('/api/v1/analyses/8').flush(doneAnalysis(null, { state: 'failed', results: null, error: engineError }));
    await settle(fixture);
    httpController().expectOne('/api/v1/studies/12').flush(glucoseStudy({ findings: 'failed' }));
    await settle(fixture);
    expect(banners()).toEqual([`The analysis failed: ${engineError}. Check the rows and settings, then run it again.`]);
    expect(el.querySelector('[data-testid="verdict-panel"]')).toBeNull();
  });

  it('shows the server’s refusal to run in words', async () => {
    const study = glucoseStudy({ latestAnalysisId: null, currentAnalysisId: null, findings: 'none' });
    const { fixture, button, banners } = await mount(['technologist'], study);
    button('run-analysis')!.click();
    await settle(fixture);
    httpController().expectOne('/api/v1/studies/12/analyses').flush(
      apiError('An analysis needs at least 3 included rows; the study has 2', [{ path: 'rows', message: 'too few rows' }]),
      { status: 400, statusText: 'Bad Request' },
    );
    await settle(fixture);
    expect(banners()).toEqual(['An analysis needs at least 3 included rows; the study has 2']);
    expect(button('run-analysis')!.disabled).toBe(false);
  });

  it('marks findings that no longer describe the rows and offers to run again', async () => {
    const study = glucoseStudy({ findings: 'out-of-date' });
    const { fixture, el, text, button, results } = await mount(['technologist'], study);
    httpController().expectOne('/api/v1/analyses/8').flush(doneAnalysis(results, { current: false }));
    await settle(fixture);
    httpController().expectOne('/api/v1/studies/12').flush(study);
    await settle(fixture);
    expect(words(el.querySelector('[data-testid="out-of-date"] .banner > span'))).toBe(
      'The rows or settings changed after these findings were made; they describe the earlier data. Run the analysis again to bring them up to date.',
    );
    expect(button('rerun')!.disabled).toBe(false);
    expect(text('verdict-overall')).toBe(CONCLUSION);
  });

  it('lets a reader without an entering role read the findings, with no run button', async () => {
    const { fixture, el, text, results } = await mount(['quality'], glucoseStudy());
    httpController().expectOne('/api/v1/analyses/8').flush(doneAnalysis(results));
    await settle(fixture);
    httpController().expectOne('/api/v1/studies/12').flush(glucoseStudy());
    await settle(fixture);
    expect(el.querySelector('[data-testid="run-analysis"]')).toBeNull();
    expect(text('verdict-overall')).toBe(CONCLUSION);
    expect(text('caution')).toBe(CAUTION);
  });
});
