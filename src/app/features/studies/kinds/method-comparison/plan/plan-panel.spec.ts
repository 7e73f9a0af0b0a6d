import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { ComponentFixture } from '@angular/core/testing';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatProgressBarHarness } from '@angular/material/progress-bar/testing';
import type { SamplePlan } from '@shared/kinds/method-comparison/sample-plan';
import type { Analysis, Analyte, ImprecisionSuggestion, Instrument, Role, Study, StudyPlan } from '@shared/schemas';
import { StudySettings } from '@shared/schemas';
import type { ComparisonPlanResult } from '@shared/stats/plan-comparison';
import { apiError, httpController, noAnimations, provideTestHttp } from '../../../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../../../testing/session-users';
import { SetupTab } from '../../../setup/setup-tab/setup-tab';
import { StudyStore } from '../../../study/study-store';
import { hopelessPlan, recommendingPlan } from './plan-results.testing';

const GLUCOSE: Analyte = {
  id: 3, name: 'Glucose', unit: 'mmol/L', decimals: 1, decisionLevels: [2.8, 7, 11.1], allowableBiasAbsolute: 0.2,
  allowableBiasPercent: 4, allowableBiasSource: 'Laboratory goal', canBeNegative: false, active: true,
};
const LINES: Instrument[] = [1, 2].map((id) => ({ id, name: `Chemistry line ${id}`, model: '', serial: '', location: '', active: true }));
const SAVED_PLAN: SamplePlan = {
  errorModel: 'proportional', cvComparative: 2, cvCandidate: 1.5, low: 3, high: 20, shape: 'uniform', earlierStudyId: null,
  n: [20, 40], simulations: 200, targetPower: 0.8, maxFalsePass: 0.05,
};

function study(samplePlan: SamplePlan | null, over: Partial<Study> = {}): Study {
  return {
    id: 8, kind: 'method-comparison', title: 'Glucose, line 2', purpose: '', analyte: { id: 3, name: 'Glucose' }, analyteUnit: 'mmol/L',
    comparativeInstrument: { id: 1, name: 'Chemistry line 1' }, candidateInstrument: { id: 2, name: 'Chemistry line 2' }, instrument: null,
    settings: {
      ...StudySettings.parse({ seed: 'abc123', unit: 'mmol/L', decisionLevels: [2.8, 7, 11.1], allowableBiasAbsolute: 0.2, allowableBiasPercent: 4, regression: 'deming' }),
      samplePlan,
    },
    version: 6, state: 'draft', ...over,
  } as unknown as Study;
}

const LINE_2_PRECISION: ImprecisionSuggestion = {
  studyId: 4, title: 'Glucose precision, line 2', instrument: 'Chemistry line 2', signedAt: '2026-10-01T09:00:00.000Z',
  materials: [{ name: 'Low', mean: 3.1, sd: 0.06, cv: 1.9 }, { name: 'High', mean: 16.2, sd: 0.24, cv: 1.5 }], cv: 1.9, sd: 0.24,
};

function run(over: Partial<Analysis>): Analysis {
  return {
    id: 31, studyId: 8, state: 'queued', progress: 0, engineVersion: 'parallax-stats test', seed: 'abc123', resamples: 100, inputHash: 'h', current: false,
    results: null, error: null, queuedAt: new Date().toISOString(), startedAt: null, finishedAt: null, durationMs: null, ...over,
  };
}

const done = (results: ComparisonPlanResult): Analysis => run({ state: 'done', progress: 1, results, durationMs: 1200, startedAt: new Date().toISOString() });

function plan(over: Partial<StudyPlan> = {}): StudyPlan {
  return { problems: [], latest: null, current: false, imprecision: { comparative: null, candidate: LINE_2_PRECISION }, earlierStudies: [], ...over };
}

/** The Setup tab of the study as its page composes it, with the plan panel the kind's view loads under the form. */
async function render(shown: Study, answer: StudyPlan, roles: Role[] = ['technologist']) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, provideSession(sessionUser(roles)), StudyStore] });
  await restoreSession();
  TestBed.inject(StudyStore).load(shown.id);
  httpController().expectOne(`/api/v1/studies/${shown.id}`).flush(shown);
  const fixture = TestBed.createComponent(SetupTab);
  await fixture.whenStable();
  httpController().expectOne('/api/v1/analytes').flush([GLUCOSE]);
  httpController().expectOne('/api/v1/instruments').flush(LINES);
  await settle(fixture);
  httpController().expectOne(`/api/v1/studies/${shown.id}/plan`).flush(answer);
  await settle(fixture);
  return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), root: fixture.nativeElement as HTMLElement };
}

/** Lets the lazily loaded panel come in and the page settle. */
async function settle(fixture: ComponentFixture<unknown>): Promise<void> {
  for (let i = 0; i < 3; i++) {
    await new Promise((resolve) => setTimeout(resolve, 0));
    await fixture.whenStable();
  }
}

const input = (testId: string) => MatInputHarness.with({ selector: `[data-testid="${testId}"]` });
const text = (root: HTMLElement, testId: string) => root.querySelector(`[data-testid="${testId}"]`)?.textContent?.replace(/\s+/g, ' ').trim() ?? null;
const runButton = MatButtonHarness.with({ text: /Save and run plan/ });

describe('the plan panel of a method comparison', () => {
  // jsdom has no canvas: chart.js gets no context and draws nothing, which is all these tests need.
  beforeEach(() => jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null));
  afterEach(() => httpController().verify());

  it('starts from the signed precision study, saves the plan with the version and queues its run, then follows its progress to the figures', async () => {
    const { fixture, loader, root } = await render(study(null), plan());
    expect(text(root, 'plan-from-setup')).toContain('Deming, error ratio λ = 1');
    expect(text(root, 'plan-from-setup')).toContain('2.8; 7.0; 11.1 mmol/L');
    expect(root.querySelector('[data-testid="plan-cv-candidate"]')!.closest('mat-form-field')!.textContent).toContain('Candidate method (y), Chemistry line 2: CV %');
    expect(await (await loader.getHarness(input('plan-cv-candidate'))).getValue()).toBe('1.9');
    expect(await (await loader.getHarness(input('plan-cv-comparative'))).getValue()).toBe('');
    expect(text(root, 'plan-suggestion-candidate')).toContain('From precision study “Glucose precision, line 2” (Chemistry line 2, signed): largest within-laboratory CV 1.9% over 2 materials.');

    await (await loader.getHarness(input('plan-cv-comparative'))).setValue('2');
    await (await loader.getHarness(input('plan-low'))).setValue('3');
    await (await loader.getHarness(input('plan-high'))).setValue('20');
    await (await loader.getHarness(input('plan-n'))).setValue('20, 40');
    await (await loader.getHarness(input('plan-simulations'))).setValue('200');
    await (await loader.getHarness(runButton)).click();

    const patch = httpController().expectOne({ method: 'PATCH', url: '/api/v1/studies/8' });
    expect(patch.request.body).toEqual({
      version: 6,
      settings: { samplePlan: { ...SAVED_PLAN, cvCandidate: 1.9 } },
    });
    patch.flush(study({ ...SAVED_PLAN, cvCandidate: 1.9 }, { version: 7 }));
    const post = httpController().expectOne({ method: 'POST', url: '/api/v1/studies/8/plan-runs' });
    expect(post.request.body).toEqual({});
    post.flush(plan({ latest: run({ state: 'queued' }) }));
    await settle(fixture);
    expect(text(root, 'plan-run-state')).toMatch(/^Waiting to start/);

    // Without server-sent events (jsdom has none) the run is asked for its state.
    httpController().expectOne('/api/v1/analyses/31').flush(run({ state: 'running', progress: 0.45, startedAt: new Date().toISOString() }));
    await settle(fixture);
    expect(text(root, 'plan-run-state')).toMatch(/^Running · 45 % · \d+ s$/);
    expect(await (await loader.getHarness(MatProgressBarHarness)).getValue()).toBe(45);
    expect(root.querySelector('[data-testid="plan-recommendation"]')).toBeNull();

    await new Promise((resolve) => setTimeout(resolve, 600));
    const result = recommendingPlan();
    httpController().expectOne('/api/v1/analyses/31').flush(done(result));
    httpController().expectOne('/api/v1/studies/8').flush(study({ ...SAVED_PLAN, cvCandidate: 1.9 }, { version: 7 }));
    await settle(fixture);
    // The run ended: the plan is read again to learn whether it is current.
    httpController().expectOne('/api/v1/studies/8/plan').flush(plan({ latest: done(result), current: true }));
    await settle(fixture);
    expect(root.querySelector('[data-testid="plan-progress"]')).toBeNull();
    expect(result.recommendedN).not.toBeNull();
    expect(text(root, 'plan-recommended-n')).toBe(String(result.recommendedN));
    expect(text(root, 'plan-recommendation')).toContain(`${result.recommendedN} specimens recommended`);
    expect(text(root, 'plan-reason')).toBe(result.reason);
    expect(text(root, 'plan-caution')).toContain('Decision support only');
    expect(root.querySelectorAll('[data-testid="plan-table"] tbody tr')).toHaveLength(2);
    expect(text(root, `plan-row-${result.recommendedN}`)).toContain('recommended');
    expect(text(root, 'plan-warnings')).toContain('100 bootstrap resamples');
    expect(text(root, 'plan-chart')).toContain('Target power 80%');
    expect(root.querySelector('[data-testid="plan-out-of-date"]')).toBeNull();
  });

  it('shows a refusal at the field it names, words for a Setup field, and asks for a reason once the plan was approved', async () => {
    const { fixture, loader, root } = await render(study(SAVED_PLAN), plan({ imprecision: { comparative: null, candidate: null } }));
    expect(await (await loader.getHarness(input('plan-n'))).getValue()).toBe('20, 40');

    // The plan as saved runs without a second save.
    await (await loader.getHarness(runButton)).click();
    httpController().expectOne({ method: 'POST', url: '/api/v1/studies/8/plan-runs' }).flush(
      apiError('settings.samplePlan.high: must be a number above low (3)', [
        { path: 'settings.samplePlan.high', message: 'settings.samplePlan.high: must be a number above low (3)' },
        { path: 'settings.decisionLevels', message: 'settings.decisionLevels: must name at least one decision level: the plan judges the bias there' },
      ]),
      { status: 400, statusText: 'Bad Request' },
    );
    await settle(fixture);
    const high = root.querySelector('[data-testid="plan-high"]')!.closest('mat-form-field')!;
    expect(high.querySelector('mat-error')?.textContent).toContain('Must be a number above low (3)');
    expect(text(root, 'plan-panel')).toContain('Set at least one medical decision level in Setup above: the plan judges the bias there.');
    // The Setup field it names is marked there too.
    expect(root.querySelector('[data-testid="setup-levels"]')!.closest('mat-form-field')!.querySelector('mat-error')?.textContent).toContain('must name at least one decision level');

    // A changed plan is saved first; after approval the server asks why.
    await (await loader.getHarness(input('plan-high'))).setValue('20');
    await (await loader.getHarness(input('plan-simulations'))).setValue('1000');
    await (await loader.getHarness(runButton)).click();
    httpController().expectOne({ method: 'PATCH', url: '/api/v1/studies/8' }).flush(
      apiError('The plan was approved; give a reason for changing the sample plan', [{ path: 'reason', message: 'The plan was approved; give a reason for changing the sample plan' }]),
      { status: 400, statusText: 'Bad Request' },
    );
    await settle(fixture);
    const reason = await loader.getHarness(input('plan-reason-field'));
    expect(root.querySelector('[data-testid="plan-reason-field"]')!.closest('mat-form-field')!.textContent).toContain('give a reason for changing the sample plan');
    await reason.setValue('More simulated studies for steadier figures');
    await (await loader.getHarness(runButton)).click();
    const patch = httpController().expectOne({ method: 'PATCH', url: '/api/v1/studies/8' });
    expect(patch.request.body).toEqual({ version: 6, settings: { samplePlan: { ...SAVED_PLAN, simulations: 1000 } }, reason: 'More simulated studies for steadier figures' });
    patch.flush(study({ ...SAVED_PLAN, simulations: 1000 }, { version: 7 }));
    httpController().expectOne({ method: 'POST', url: '/api/v1/studies/8/plan-runs' }).flush(plan({ latest: run({ state: 'queued' }) }));
    await settle(fixture);
    httpController().expectOne('/api/v1/analyses/31').flush(run({ state: 'failed', error: 'the worker stopped' }));
    httpController().expectOne('/api/v1/studies/8').flush(study({ ...SAVED_PLAN, simulations: 1000 }, { version: 7 }));
    await settle(fixture);
    httpController().expectOne('/api/v1/studies/8/plan').flush(plan({ latest: run({ state: 'failed', error: 'the worker stopped' }) }));
    await settle(fixture);
    expect(text(root, 'plan-panel')).toContain('The plan run failed: the worker stopped. Check the plan and Setup, then run it again.');
  });

  it('checks the numbers to try before sending anything, naming the entry that is wrong', async () => {
    const { loader, root } = await render(study(SAVED_PLAN), plan());
    await (await loader.getHarness(input('plan-n'))).setValue('20, 4x');
    await (await loader.getHarness(runButton)).click();
    expect(root.querySelector('[data-testid="plan-n"]')!.closest('mat-form-field')!.querySelector('mat-error')?.textContent).toContain('“4x” is not a whole number');
    expect(text(root, 'plan-panel')).toContain('Check the marked fields of the plan.');
  });

  it('says in words when no number on the grid will do, and when the figures no longer match the plan', async () => {
    const result = hopelessPlan();
    const { root } = await render(study(SAVED_PLAN), plan({ latest: done(result), current: false }));
    expect(root.querySelector('[data-testid="plan-recommended-n"]')).toBeNull();
    expect(text(root, 'plan-no-recommendation')).toBe('block No number of specimens on the grid meets both targets');
    expect(text(root, 'plan-reason')).toMatch(/^No n on the grid meets both targets; at the largest, 20:/);
    expect(text(root, 'plan-out-of-date')).toContain('The plan or Setup changed after these figures were made');
    expect(text(root, 'plan-row-10')).toContain('power below target');
  });

  it('shows a quality officer the stored figures and the plan, read-only', async () => {
    const result = recommendingPlan();
    const { loader, root } = await render(study(SAVED_PLAN), plan({ latest: done(result), current: true }), ['quality']);
    expect(await loader.getAllHarnesses(runButton)).toHaveLength(0);
    expect(await (await loader.getHarness(input('plan-n'))).isDisabled()).toBe(true);
    expect(await (await loader.getHarness(input('plan-cv-comparative'))).getValue()).toBe('2');
    expect(text(root, 'plan-recommended-n')).toBe(String(result.recommendedN));
    expect(root.querySelector('[data-testid="plan-use-candidate"]')).toBeNull();
  });
});
