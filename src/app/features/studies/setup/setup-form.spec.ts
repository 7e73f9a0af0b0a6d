import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { Analyte, Instrument, Study } from '@shared/schemas';
import { StudySettings } from '@shared/schemas';
import { apiError, httpController, noAnimations, provideTestHttp } from '../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../testing/session-users';
import { STUDY_CONFLICT_TEXT, StudyStore } from '../study/study-store';
import { SetupForm } from './setup-form';
import { SetupTab } from './setup-tab/setup-tab';

const GLUCOSE: Analyte = {
  id: 3, name: 'Glucose', unit: 'mmol/L', decimals: 1, decisionLevels: [2.8, 7, 11.1], allowableBiasAbsolute: 0.2,
  allowableBiasPercent: 4, allowableBiasSource: 'Laboratory goal', canBeNegative: false, active: true,
};
const LINES: Instrument[] = [1, 2].map((id) => ({ id, name: `Chemistry line ${id}`, model: '', serial: '', location: '', active: true }));
const STUDY = {
  id: 8, kind: 'method-comparison', title: 'Glucose, line 2', purpose: '', analyte: { id: 3, name: 'Glucose' }, analyteUnit: 'mmol/L',
  comparativeInstrument: { id: 1, name: 'Chemistry line 1' }, candidateInstrument: { id: 2, name: 'Chemistry line 2' }, instrument: null,
  settings: StudySettings.parse({ seed: 'abc123', unit: 'mmol/L', decisionLevels: [7] }), version: 6, state: 'draft',
} as unknown as Study;

/** A new study's form, or the Setup tab of a loaded study (the form as its page composes it). */
async function render(study: Study | null) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, provideSession(sessionUser(['technologist'])), StudyStore] });
  await restoreSession();
  if (study) {
    TestBed.inject(StudyStore).load(study.id);
    httpController().expectOne(`/api/v1/studies/${study.id}`).flush(study);
  }
  const fixture = study ? TestBed.createComponent(SetupTab) : TestBed.createComponent(SetupForm);
  await fixture.whenStable();
  httpController().expectOne('/api/v1/analytes').flush([GLUCOSE]);
  httpController().expectOne('/api/v1/instruments').flush(LINES);
  await fixture.whenStable();
  return { fixture, loader: TestbedHarnessEnvironment.loader(fixture) };
}

const input = (testId: string) => MatInputHarness.with({ selector: `[data-testid="${testId}"]` });
const select = (testId: string) => MatSelectHarness.with({ selector: `[data-testid="${testId}"]` });

describe('SetupForm', () => {
  // A comparison's Setup reads its plan too (the plan panel, tested in kinds/method-comparison/plan/).
  afterEach(() => {
    httpController().match((req) => req.url.endsWith('/plan'));
    httpController().verify();
  });

  it("brings the chosen analyte's unit, decision levels and allowable bias into a new study, with a random seed shown", async () => {
    const { loader } = await render(null);
    expect(await (await loader.getHarness(input('setup-seed'))).getValue()).toMatch(/^[0-9a-f]{12}$/);
    const analyte = await loader.getHarness(select('setup-analyte'));
    await analyte.open();
    await analyte.clickOptions({ text: 'Glucose (mmol/L)' });
    expect(await (await loader.getHarness(input('setup-unit'))).getValue()).toBe('mmol/L');
    expect(await (await loader.getHarness(input('setup-levels'))).getValue()).toBe('2.8, 7, 11.1');
    expect(await (await loader.getHarness(input('setup-bias-abs'))).getValue()).toBe('0.2');
    expect(await (await loader.getHarness(input('setup-bias-source'))).getValue()).toBe('Laboratory goal');
  });

  it('shows the Deming error ratio, with its convention, only for the Deming methods', async () => {
    const { loader, fixture } = await render(null);
    expect(await loader.getAllHarnesses(input('setup-deming-ratio'))).toHaveLength(0);
    const regression = await loader.getHarness(select('setup-regression'));
    await regression.open();
    await regression.clickOptions({ text: 'Weighted Deming' });
    expect(await loader.getAllHarnesses(input('setup-deming-ratio'))).toHaveLength(1);
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('λ = σ²(x error) / σ²(y error)');
  });

  it('offers the decimal mark of entered and imported results, detected by default, and saves the choice', async () => {
    const { loader } = await render(STUDY);
    const mark = await loader.getHarness(select('setup-decimal-mark'));
    expect(await mark.getValueText()).toBe('Detect (refuse unclear values)');
    await mark.open();
    expect(await Promise.all((await mark.getOptions()).map((o) => o.getText()))).toEqual([
      'Detect (refuse unclear values)', 'Point (comma separates thousands)', 'Comma (point separates thousands)',
    ]);
    await mark.clickOptions({ text: 'Comma (point separates thousands)' });
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save setup' }))).click();
    const patch = httpController().expectOne({ method: 'PATCH', url: '/api/v1/studies/8' });
    expect(patch.request.body.settings.decimalMark).toBe('comma');
    patch.flush({ ...STUDY, version: 7, settings: { ...STUDY.settings, decimalMark: 'comma' } });
  });

  it('saves with the version it was loaded at, and on a conflict offers to reload instead of overwriting', async () => {
    const { loader, fixture } = await render(STUDY);
    await (await loader.getHarness(input('setup-title'))).setValue('Glucose, line 2 (revised)');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save setup' }))).click();
    const patch = httpController().expectOne({ method: 'PATCH', url: '/api/v1/studies/8' });
    expect(patch.request.body).toMatchObject({ version: 6, title: 'Glucose, line 2 (revised)', analyteId: 3, comparativeInstrumentId: 1 });
    patch.flush(apiError('Someone else changed this study since you loaded it', [{ path: 'version', message: 'You have version 6' }]), { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('[data-testid="setup-conflict"]')?.textContent).toContain(STUDY_CONFLICT_TEXT);
    expect(await (await loader.getHarness(MatButtonHarness.with({ text: 'Save setup' }))).isDisabled()).toBe(true);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Reload' }))).click();
    httpController().expectOne('/api/v1/studies/8').flush({ ...STUDY, version: 7, title: 'Their title' });
    await fixture.whenStable();
    expect(await (await loader.getHarness(input('setup-title'))).getValue()).toBe('Their title');
    expect(el.querySelector('[data-testid="setup-conflict"]')).toBeNull();
  });

  it('asks for a reason when the server says the approved plan changes, and sends it', async () => {
    const { loader, fixture } = await render(STUDY);
    await (await loader.getHarness(input('setup-levels'))).setValue('2.8, 7.0');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save setup' }))).click();
    httpController().expectOne({ method: 'PATCH', url: '/api/v1/studies/8' }).flush(
      apiError('The plan was approved; give a reason for changing the decision levels', [{ path: 'reason', message: 'The plan was approved; give a reason for changing the decision levels' }]),
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    const reason = await loader.getHarness(input('setup-reason'));
    expect((fixture.nativeElement as HTMLElement).querySelector('[data-testid="setup-reason"]')!.closest('mat-form-field')!.textContent).toContain('give a reason for changing the decision levels');
    await reason.setValue('Levels agreed with the clinicians');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save setup' }))).click();
    const patch = httpController().expectOne({ method: 'PATCH', url: '/api/v1/studies/8' });
    expect(patch.request.body.reason).toBe('Levels agreed with the clinicians');
    patch.flush({ ...STUDY, version: 7 });
  });

  it("shows the kind's own panel under the form: how often the rule accepts, for a verification", async () => {
    jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
    const { loader, fixture } = await render(null);
    const kind = await loader.getHarness(select('setup-kind'));
    await kind.open();
    await kind.clickOptions({ text: 'Reference interval: verify' });
    for (let i = 0; i < 3; i++) {
      await new Promise((resolve) => setTimeout(resolve, 0));
      await fixture.whenStable();
    }
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('[data-testid="transference-plan"]')).not.toBeNull();
    expect(el.querySelector('[data-testid="plan-panel"]')).toBeNull();
  });
});
