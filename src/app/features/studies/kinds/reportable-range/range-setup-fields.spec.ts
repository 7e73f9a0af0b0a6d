import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { RangeSettings } from '@shared/kinds/reportable-range/meta';
import type { Analyte, Instrument, Study } from '@shared/schemas';
import { StudySettings } from '@shared/schemas';
import { httpController, noAnimations, provideTestHttp } from '../../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../../testing/session-users';
import { SetupForm } from '../../setup/setup-form';
import { buildSetupForm, type OpenSettingsGroup, type SetupGroup } from '../../setup/setup-form-group';
import { setupValues } from '../../setup/setup-model';
import { SetupTab } from '../../setup/setup-tab/setup-tab';
import { StudyStore } from '../../study/study-store';
import { RANGE_RULES } from './guidance';
import { RangeSetupFields } from './range-setup-fields';
import { type LevelsArray, RANGE_KEYS, rangeControls } from './settings-controls';

const ASSIGNED = [2, 8, 14, 20, 26, 32].map((assigned, i) => ({ name: `L${i + 1}`, assigned, fraction: null }));
const own = (form: SetupGroup) => form.controls.settings as unknown as OpenSettingsGroup;
const levelsOf = (form: SetupGroup) => own(form).get('levels') as LevelsArray | null;

/** The fields on a form, as the Setup form shows them when the kind is chosen. */
async function show(form: SetupGroup) {
  TestBed.configureTestingModule({ providers: [noAnimations] });
  const fixture = TestBed.createComponent(RangeSetupFields);
  fixture.componentRef.setInput('form', form);
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const button = (testId: string) => loader.getHarness(MatButtonHarness.with({ selector: `[data-testid="${testId}"]` }));
  const input = async (testId: string, index = 0) => (await loader.getAllHarnesses(MatInputHarness.with({ selector: `[data-testid="${testId}"]` })))[index];
  const errors = async (testId: string, index = 0) =>
    (await loader.getAllHarnesses(MatFormFieldHarness.with({ selector: `:has(> * [data-testid="${testId}"]), :has([data-testid="${testId}"])` })))[index].getTextErrors();
  const text = (testId: string) => el.querySelector(`[data-testid="${testId}"]`)?.textContent?.replace(/\s+/g, ' ').trim() ?? null;
  return { fixture, el, loader, button, input, errors, text };
}
const newRangeForm = () => buildSetupForm({ ...setupValues(null, 'abc123'), kind: 'reportable-range' });

describe('RangeSetupFields on a new study', () => {
  it('adds five levels to value, 2 replicates and α = 0.05, with the kind’s rules and the planned count', async () => {
    const form = newRangeForm();
    const { el } = await show(form);
    expect(RANGE_KEYS.every((key) => own(form).contains(key))).toBe(true);
    expect(el.querySelectorAll('[data-testid="levels-table"] tbody tr')).toHaveLength(5);
    const s = form.controls.settings.controls;
    expect([s.outlierRule.value, s.acceptanceRule.value, s.plannedSpecimens.value]).toEqual([RANGE_RULES.outlierRule, RANGE_RULES.acceptanceRule, 10]);
    expect(form.controls.instrumentId.hasError('required')).toBe(true);
    expect(form.valid).toBe(false);
  });

  it('adds and removes levels (5 to 11), naming new ones, the planned count following levels × replicates', async () => {
    const form = newRangeForm();
    const { el, fixture, button, input } = await show(form);
    const add = await button('level-add');
    expect(await (await button('level-remove')).isDisabled()).toBe(true);
    await add.click();
    expect(levelsOf(form)?.at(5).controls.name.value).toBe('Level 6');
    expect(form.controls.settings.controls.plannedSpecimens.value).toBe(12);
    for (let i = 0; i < 5; i++) await add.click();
    expect(levelsOf(form)?.length).toBe(11);
    expect(await add.isDisabled()).toBe(true);
    el.querySelectorAll<HTMLButtonElement>('[data-testid="level-remove"]')[1].click();
    await fixture.whenStable();
    expect(levelsOf(form)?.length).toBe(10);
    expect(levelsOf(form)?.getRawValue().map((l) => l.name)).not.toContain('Level 2');
    await (await input('setup-replicates')).setValue('3');
    expect(form.controls.settings.controls.plannedSpecimens.value).toBe(30);
    await add.click();
    expect(levelsOf(form)?.at(10).controls.name.value).toBe('Level 12');
    expect(form.dirty).toBe(true);
  });

  it('fills N levels evenly as fractions, keeping the names and clearing assigned values', async () => {
    const form = newRangeForm();
    const { button, input } = await show(form);
    levelsOf(form)!.at(0).patchValue({ name: 'Low pool', assigned: 3 });
    await (await input('level-even-count')).setValue('7');
    await (await button('level-fill-even')).click();
    expect(levelsOf(form)!.getRawValue()).toEqual([
      { name: 'Low pool', assigned: null, fraction: 0 },
      ...[0.1667, 0.3333, 0.5, 0.6667, 0.8333, 1].map((fraction, k) => ({ name: `Level ${k + 2}`, assigned: null, fraction })),
    ]);
    expect(form.controls.settings.controls.plannedSpecimens.value).toBe(14);
    expect(own(form).get('poolLow')?.errors).toBeNull();
    await (await input('level-even-count')).setValue('5');
    await (await button('level-fill-even')).click();
    expect(levelsOf(form)!.getRawValue().map((l) => l.fraction)).toEqual([0, 0.25, 0.5, 0.75, 1]);
    await (await input('level-even-count')).setValue('12');
    expect(await (await button('level-fill-even')).isDisabled()).toBe(true);
  });

  it("shows the shared schema's words under the field that has them, the joined rules included", async () => {
    const form = newRangeForm();
    const { fixture, input, errors, text } = await show(form);
    await (await input('level-name', 1)).setValue('level 1');
    await (await input('level-assigned', 0)).setValue('2');
    await (await input('level-fraction', 0)).setValue('0.5');
    await (await input('level-fraction', 2)).setValue('1.5');
    await (await input('setup-pool-low')).setValue('5');
    await (await input('setup-claimed-low')).setValue('30');
    await (await input('setup-claimed-high')).setValue('2');
    await (await input('setup-replicates')).setValue('0');
    form.markAllAsTouched();
    await fixture.whenStable();
    expect(await errors('level-assigned', 0)).toEqual(['Give the level either an assigned value or a mixing fraction, not both']);
    expect(await errors('level-fraction', 2)).toEqual(['The mixing fraction must be from 0 to 1']);
    expect(text('levels-error')).toBe('Give each level its own name');
    expect(await errors('setup-pool-high')).toEqual(['Give both pool values or neither']);
    expect(await errors('setup-claimed-high')).toEqual(['The claimed high end must be above the claimed low end']);
    expect(await errors('setup-replicates')).toEqual(['Plan at least 1 replicate a level']);
  });

  it('shows the value the pools make of a fraction beside it, in the study’s decimals', async () => {
    const form = newRangeForm();
    form.controls.settings.controls.unit.setValue('mmol/L');
    form.controls.settings.controls.decimals.setValue(1);
    const { fixture, input, el } = await show(form);
    const pooled = () => Array.from(el.querySelectorAll('[data-testid="level-pooled"]')).map((e) => e.textContent!.trim());
    await (await input('level-fraction', 1)).setValue('0.25');
    expect(pooled()).toEqual(['', '', '', '', '']);
    await (await input('setup-pool-low')).setValue('2');
    await (await input('setup-pool-high')).setValue('32');
    await fixture.whenStable();
    expect(pooled()).toEqual(['', '9.5', '', '', '']);
    expect(el.querySelectorAll('[data-testid="levels-table"] thead th')[4].textContent!.trim()).toBe('From the pools (mmol/L)');
  });

  it('says how the goal applies: the larger of the two when both are given', async () => {
    const form = newRangeForm();
    form.controls.settings.controls.unit.setValue('mmol/L');
    const { input, text } = await show(form);
    expect(text('goal-note')).toBe('Give one or both: the deviation from linearity at each level is judged against it.');
    await (await input('setup-nonlinearity')).setValue('0.3');
    expect(text('goal-note')).toBe('Give both to judge each level by the larger of the two.');
    await (await input('setup-nonlinearity-percent')).setValue('2.5');
    expect(text('goal-note')).toBe('Both are given: at each level the larger of 0.3 mmol/L and 2.5 % of the level applies.');
  });

  it('takes its settings, rules and count back when another kind is chosen', async () => {
    const form = newRangeForm();
    const { fixture } = await show(form);
    form.controls.kind.setValue('interval-verify');
    fixture.destroy();
    expect(RANGE_KEYS.some((key) => own(form).contains(key))).toBe(false);
    const s = form.controls.settings.controls;
    const defaults = StudySettings.parse({});
    expect([s.outlierRule.value, s.acceptanceRule.value, s.plannedSpecimens.value]).toEqual([defaults.outlierRule, defaults.acceptanceRule, null]);
    expect(form.controls.instrumentId.hasError('required')).toBe(false);
  });
});

const savedStudy = (own: Partial<RangeSettings>, common: Partial<StudySettings> = {}) => ({
  id: 12, kind: 'reportable-range', title: 'Glucose range', purpose: '', analyte: { id: 3, name: 'Glucose' }, analyteUnit: 'mmol/L',
  comparativeInstrument: null, candidateInstrument: null, instrument: { id: 4, name: 'Chemistry line 4' }, version: 3, state: 'draft',
  settings: { ...StudySettings.parse({ seed: 'abc', unit: 'mmol/L', ...common }), ...RangeSettings.parse(own) },
}) as unknown as Study;

describe('RangeSetupFields on a saved study', () => {
  it('shows its levels as stored, leaves its rules and count alone, and shows no buttons when read-only', async () => {
    const form = buildSetupForm(setupValues(savedStudy({ levels: ASSIGNED }, { outlierRule: 'Grubbs', plannedSpecimens: null }), 'x'), rangeControls);
    form.controls.kind.disable();
    form.disable();
    const { el } = await show(form);
    expect(el.querySelectorAll('[data-testid="levels-table"] tbody tr')).toHaveLength(6);
    expect(levelsOf(form)?.getRawValue()).toEqual(ASSIGNED);
    expect(form.controls.settings.controls.outlierRule.value).toBe('Grubbs');
    expect(form.controls.settings.controls.plannedSpecimens.value).toBeNull();
    expect(el.querySelector('[data-testid="level-add"]')).toBeNull();
    expect(el.querySelector('[data-testid="level-remove"]')).toBeNull();
    expect(form.dirty).toBe(false);
  });

  it('says when fewer than 5 levels are stored', async () => {
    const form = buildSetupForm(setupValues(savedStudy({ levels: ASSIGNED.slice(0, 3) }), 'x'), rangeControls);
    const { text } = await show(form);
    expect(text('levels-few')).toBe('At least 5 levels are needed before the study is submitted; it has 3.');
  });
});

const GLUCOSE: Analyte = {
  id: 3, name: 'Glucose', unit: 'mmol/L', decimals: 1, decisionLevels: [7], allowableBiasAbsolute: null, allowableBiasPercent: null,
  allowableBiasSource: '', canBeNegative: false, active: true,
};
const LINES: Instrument[] = [4, 5].map((id) => ({ id, name: `Chemistry line ${id}`, model: '', serial: '', location: '', active: true }));

async function page(study: Study | null) {
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
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const type = async (testId: string, value: string, index = 0) => (await loader.getAllHarnesses(MatInputHarness.with({ selector: `[data-testid="${testId}"]` })))[index].setValue(value);
  const choose = async (testId: string, text: string) => {
    const select = await loader.getHarness(MatSelectHarness.with({ selector: `[data-testid="${testId}"]` }));
    await select.open();
    await select.clickOptions({ text });
  };
  return { fixture, loader, type, choose, el: fixture.nativeElement as HTMLElement };
}

describe('a reportable-range study in the Setup form', () => {
  afterEach(() => httpController().verify());

  it('is created with its instrument, levels, goal and claim, and with the bootstrap settings its CIs use', async () => {
    const { loader, type, choose, el } = await page(null);
    await choose('setup-kind', 'Reportable range');
    expect(el.querySelector('[data-testid="setup-bootstrap"]')).not.toBeNull();
    expect(el.querySelector('[data-testid="setup-analysis-note"]')?.textContent).toMatch(/^The CI of the deviation at each level is a percentile bootstrap/);
    await type('setup-title', 'Glucose reportable range, line 4');
    await choose('setup-analyte', 'Glucose (mmol/L)');
    await choose('setup-instrument', 'Chemistry line 4');
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="level-fill-even"]' }))).click();
    await type('setup-pool-low', '1.5');
    await type('setup-pool-high', '33');
    await type('setup-nonlinearity', '0.2');
    await type('setup-nonlinearity-percent', '3');
    await type('setup-nonlinearity-source', 'Lab policy');
    await type('setup-claimed-low', '1.5');
    await type('setup-claimed-high', '33');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Create study' }))).click();
    const post = httpController().expectOne({ method: 'POST', url: '/api/v1/studies' });
    expect(post.request.body).toMatchObject({ kind: 'reportable-range', title: 'Glucose reportable range, line 4', analyteId: 3, instrumentId: 4 });
    expect(post.request.body).not.toHaveProperty('comparativeInstrumentId');
    expect(post.request.body.settings).toMatchObject({
      levels: [0, 0.25, 0.5, 0.75, 1].map((fraction, k) => ({ name: `Level ${k + 1}`, assigned: null, fraction })),
      poolLow: 1.5, poolHigh: 33, replicates: 2, allowableNonlinearity: 0.2, allowableNonlinearityPercent: 3, nonlinearitySource: 'Lab policy',
      claimedLow: 1.5, claimedHigh: 33, alpha: 0.05, outlierRule: RANGE_RULES.outlierRule, plannedSpecimens: 10, unit: 'mmol/L',
    });
    post.flush({ id: 9 });
  });

  it('brings a saved study’s levels into the form and saves a changed level with the others', async () => {
    const study = savedStudy({ levels: ASSIGNED, replicates: 3, allowableNonlinearity: 0.3, claimedLow: 2, claimedHigh: 32 });
    const { loader, type, el } = await page(study);
    expect(el.querySelectorAll('[data-testid="levels-table"] tbody tr')).toHaveLength(6);
    expect(await (await loader.getAllHarnesses(MatInputHarness.with({ selector: '[data-testid="level-name"]' })))[1].getValue()).toBe('L2');
    expect(await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="setup-replicates"]' }))).getValue()).toBe('3');
    await type('level-assigned', '8.5', 1);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save setup' }))).click();
    const patch = httpController().expectOne({ method: 'PATCH', url: '/api/v1/studies/12' });
    expect(patch.request.body.settings).toMatchObject({ levels: [ASSIGNED[0], { ...ASSIGNED[1], assigned: 8.5 }, ...ASSIGNED.slice(2)], replicates: 3, claimedHigh: 32 });
    expect(patch.request.body).toMatchObject({ instrumentId: 4, version: 3 });
    patch.flush({ ...study, version: 4, settings: patch.request.body.settings });
  });
});
