import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { PrecisionSettings } from '@shared/kinds/precision/meta';
import type { Analyte, Instrument, Study } from '@shared/schemas';
import { StudySettings } from '@shared/schemas';
import { httpController, noAnimations, provideTestHttp } from '../../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../../testing/session-users';
import { SetupForm } from '../../setup/setup-form';
import { buildSetupForm, type OpenSettingsGroup, type SetupGroup } from '../../setup/setup-form-group';
import { setupValues } from '../../setup/setup-model';
import { SetupTab } from '../../setup/setup-tab/setup-tab';
import { StudyStore } from '../../study/study-store';
import { PRECISION_RULES } from './guidance';
import { PrecisionSetupFields } from './precision-setup-fields';
import { type MaterialsArray, precisionControls } from './settings-controls';

const LEVEL_1 = { name: 'Level 1', claimRepeatability: 0.12, claimWithinLab: 0.2, claimAs: 'sd' as const, assignedValue: null, assignedUncertainty: null, assignedSource: '' };
const LEVEL_2 = { name: 'Level 2', claimRepeatability: 1.5, claimWithinLab: 2.5, claimAs: 'cv' as const, assignedValue: 12.1, assignedUncertainty: 0.2, assignedSource: 'certificate' };
const own = (form: SetupGroup) => form.controls.settings as unknown as OpenSettingsGroup;
const materialsOf = (form: SetupGroup) => own(form).get('materials') as MaterialsArray | null;
const OWN_KEYS = ['materials', 'days', 'replicates', 'alpha', 'controlLot'];

/** The fields on a form, as the Setup form shows them when the kind is chosen. */
async function show(form: SetupGroup) {
  TestBed.configureTestingModule({ providers: [noAnimations] });
  const fixture = TestBed.createComponent(PrecisionSetupFields);
  fixture.componentRef.setInput('form', form);
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  return { fixture, el, loader: TestbedHarnessEnvironment.loader(fixture) };
}
const newPrecisionForm = () => buildSetupForm({ ...setupValues(null, 'abc123'), kind: 'precision' });

describe('PrecisionSetupFields on a new study', () => {
  it('adds 5 days × 5 replicates, α = 0.05 and one empty material, with the precision rules and planned count', async () => {
    const form = newPrecisionForm();
    const { el } = await show(form);
    expect(OWN_KEYS.every((key) => own(form).contains(key))).toBe(true);
    expect(el.querySelectorAll('fieldset.material')).toHaveLength(1);
    const s = form.controls.settings.controls;
    expect([s.outlierRule.value, s.acceptanceRule.value, s.plannedSpecimens.value]).toEqual([PRECISION_RULES.outlierRule, PRECISION_RULES.acceptanceRule, 25]);
    expect(form.controls.instrumentId.hasError('required')).toBe(true);
    expect(form.valid).toBe(false);
  });

  it('adds and removes materials (at least one, at most 6), the planned count following', async () => {
    const form = newPrecisionForm();
    const { el, fixture, loader } = await show(form);
    const add = await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="material-add"]' }));
    expect(el.querySelector('[data-testid="material-remove"]')).toBeNull();
    await add.click();
    expect(el.querySelectorAll('fieldset.material')).toHaveLength(2);
    expect(form.controls.settings.controls.plannedSpecimens.value).toBe(50);
    for (let i = 0; i < 4; i++) await add.click();
    expect(materialsOf(form)?.length).toBe(6);
    expect(await add.isDisabled()).toBe(true);
    expect(el.textContent).toContain('At most 6 materials in one study.');
    (el.querySelectorAll<HTMLButtonElement>('[data-testid="material-remove"]')[1]).click();
    await fixture.whenStable();
    expect(materialsOf(form)?.length).toBe(5);
    expect(form.controls.settings.controls.plannedSpecimens.value).toBe(125);
    expect(form.dirty).toBe(true);
  });

  it('keeps a planned count the user typed', async () => {
    const form = newPrecisionForm();
    const { loader } = await show(form);
    form.controls.settings.controls.plannedSpecimens.setValue(60);
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="material-add"]' }))).click();
    expect(form.controls.settings.controls.plannedSpecimens.value).toBe(60);
  });

  it('keeps following the design when a number of it is cleared and typed again', async () => {
    const form = newPrecisionForm();
    await show(form);
    const s = own(form);
    expect(form.controls.settings.controls.plannedSpecimens.value).toBe(25);
    form.markAsDirty();
    s.get('replicates')!.setValue(null);
    expect(form.controls.settings.controls.plannedSpecimens.value).toBe(25);
    s.get('replicates')!.setValue(3);
    expect(form.controls.settings.controls.plannedSpecimens.value).toBe(15);
  });

  it("shows the shared schema's words under the field that has them", async () => {
    const form = newPrecisionForm();
    const { fixture, loader } = await show(form);
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="material-claim-repeatability"]' }))).setValue('0.3');
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="material-claim-within-lab"]' }))).setValue('0.2');
    form.markAllAsTouched();
    await fixture.whenStable();
    const field = (testId: string) => loader.getHarness(MatFormFieldHarness.with({ selector: `:has([data-testid="${testId}"])` }));
    expect(await (await field('material-name')).getTextErrors()).toEqual(['Give the material a name']);
    expect(await (await field('material-claim-within-lab')).getTextErrors()).toEqual(['The within-laboratory claim cannot be smaller than the repeatability claim']);
    expect(await (await field('material-claim-repeatability')).getTextErrors()).toEqual([]);
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="setup-days"]' }))).setValue('1');
    expect(await (await field('setup-days')).getTextErrors()).toEqual(['Plan at least 2 days']);
  });

  it('names the claims by their kind: SDs in the unit, or CVs in %', async () => {
    const form = newPrecisionForm();
    form.controls.settings.controls.unit.setValue('mmol/L');
    const { loader } = await show(form);
    const label = async (testId: string) => (await loader.getHarness(MatFormFieldHarness.with({ selector: `:has([data-testid="${testId}"])` }))).getLabel();
    expect(await label('material-claim-repeatability')).toBe('Repeatability claim (SD, mmol/L)');
    const claimAs = await loader.getHarness(MatSelectHarness.with({ selector: '[data-testid="material-claim-as"]' }));
    await claimAs.open();
    await claimAs.clickOptions({ text: 'CVs, in %' });
    expect(await label('material-claim-repeatability')).toBe('Repeatability claim (CV %)');
    expect(await label('material-claim-within-lab')).toBe('Within-laboratory claim (CV %)');
  });

  it('takes its settings, rules and count back when another kind is chosen', async () => {
    const form = newPrecisionForm();
    const { fixture } = await show(form);
    form.controls.kind.setValue('interval-verify');
    fixture.destroy();
    expect(OWN_KEYS.some((key) => own(form).contains(key))).toBe(false);
    const s = form.controls.settings.controls;
    const defaults = StudySettings.parse({});
    expect([s.outlierRule.value, s.acceptanceRule.value, s.plannedSpecimens.value]).toEqual([defaults.outlierRule, defaults.acceptanceRule, null]);
    expect(form.controls.instrumentId.hasError('required')).toBe(false);
  });
});

describe('PrecisionSetupFields on a saved study', () => {
  it('shows its materials as stored and leaves its rules and count alone', async () => {
    const study = {
      kind: 'precision', title: 'T', purpose: '', analyte: { id: 3, name: 'Glucose' }, comparativeInstrument: null, candidateInstrument: null,
      instrument: { id: 4, name: 'Line 1' }, settings: { ...StudySettings.parse({ outlierRule: 'Grubbs', plannedSpecimens: null }), ...PrecisionSettings.parse({ materials: [LEVEL_1, LEVEL_2] }) },
    } as unknown as Study;
    const form = buildSetupForm(setupValues(study, 'x'), precisionControls);
    form.controls.kind.disable();
    const { el } = await show(form);
    expect(el.querySelectorAll('fieldset.material')).toHaveLength(2);
    expect(materialsOf(form)?.getRawValue()).toEqual([LEVEL_1, LEVEL_2]);
    expect(form.controls.settings.controls.outlierRule.value).toBe('Grubbs');
    expect(form.controls.settings.controls.plannedSpecimens.value).toBeNull();
    expect(form.dirty).toBe(false);
  });

  it('shows the materials of a study that can no longer change (its form disabled), without adding controls', async () => {
    const study = {
      kind: 'precision', title: 'T', purpose: '', analyte: { id: 3, name: 'Glucose' }, comparativeInstrument: null, candidateInstrument: null,
      instrument: { id: 4, name: 'Line 1' }, settings: { ...StudySettings.parse({}), ...PrecisionSettings.parse({ materials: [LEVEL_1, LEVEL_2] }) },
    } as unknown as Study;
    const form = buildSetupForm(setupValues(study, 'x'), precisionControls);
    form.disable();
    const { el } = await show(form);
    expect(el.querySelectorAll('fieldset.material')).toHaveLength(2);
    expect(materialsOf(form)?.getRawValue()).toEqual([LEVEL_1, LEVEL_2]);
    expect(form.dirty).toBe(false);
  });
});

const GLUCOSE: Analyte = {
  id: 3, name: 'Glucose', unit: 'mmol/L', decimals: 2, decisionLevels: [7], allowableBiasAbsolute: null, allowableBiasPercent: null,
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

describe('a precision study in the Setup form', () => {
  afterEach(() => httpController().verify());

  it('is created with its instrument, design and materials, and without bootstrap settings', async () => {
    const { loader, type, choose, el } = await page(null);
    await choose('setup-kind', 'Precision verification');
    expect(el.querySelector('[data-testid="setup-bootstrap"]')).toBeNull();
    expect(el.querySelector('[data-testid="setup-analysis-note"]')?.textContent).toMatch(/^The findings come from a one-way analysis of variance by day/);
    await type('setup-title', 'Glucose precision, line 4');
    await choose('setup-analyte', 'Glucose (mmol/L)');
    await choose('setup-instrument', 'Chemistry line 4');
    await type('setup-control-lot', 'QC-7');
    await type('material-name', 'Level 1');
    await type('material-claim-repeatability', '0.12');
    await type('material-claim-within-lab', '0.2');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Create study' }))).click();
    const post = httpController().expectOne({ method: 'POST', url: '/api/v1/studies' });
    expect(post.request.body).toMatchObject({ kind: 'precision', title: 'Glucose precision, line 4', analyteId: 3, instrumentId: 4 });
    expect(post.request.body).not.toHaveProperty('comparativeInstrumentId');
    expect(post.request.body.settings).toMatchObject({
      materials: [LEVEL_1], days: 5, replicates: 5, alpha: 0.05, controlLot: 'QC-7', outlierRule: PRECISION_RULES.outlierRule, plannedSpecimens: 25, unit: 'mmol/L',
    });
    post.flush({ id: 9 });
  });

  it('brings a saved study’s materials into the form and saves a changed claim with the others', async () => {
    const study = {
      id: 12, kind: 'precision', title: 'Glucose precision', purpose: '', analyte: { id: 3, name: 'Glucose' }, analyteUnit: 'mmol/L',
      comparativeInstrument: null, candidateInstrument: null, instrument: { id: 4, name: 'Chemistry line 4' }, version: 3, state: 'draft',
      settings: { ...StudySettings.parse({ seed: 'abc', unit: 'mmol/L' }), ...PrecisionSettings.parse({ materials: [LEVEL_1, LEVEL_2], days: 3, controlLot: 'QC-7' }) },
    } as unknown as Study;
    const { loader, type, el } = await page(study);
    expect(el.querySelectorAll('fieldset.material')).toHaveLength(2);
    expect(await (await loader.getAllHarnesses(MatInputHarness.with({ selector: '[data-testid="material-name"]' })))[1].getValue()).toBe('Level 2');
    expect(await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="setup-days"]' }))).getValue()).toBe('3');
    await type('material-claim-within-lab', '3', 1);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save setup' }))).click();
    const patch = httpController().expectOne({ method: 'PATCH', url: '/api/v1/studies/12' });
    expect(patch.request.body.settings).toMatchObject({ materials: [LEVEL_1, { ...LEVEL_2, claimWithinLab: 3 }], days: 3, controlLot: 'QC-7' });
    expect(patch.request.body).toMatchObject({ instrumentId: 4, version: 3 });
    patch.flush({ ...study, version: 4, settings: patch.request.body.settings });
  });
});
