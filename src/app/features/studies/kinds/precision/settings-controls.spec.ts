import { FormArray, FormControl } from '@angular/forms';
import { PrecisionSettings } from '@shared/kinds/precision/meta';
import { CreateStudyBody, StudySettings, UpdateStudyBody, type Study } from '@shared/schemas';
import { buildSetupForm, readSetup, resetSetupForm, type OpenSettingsGroup } from '../../setup/setup-form-group';
import { createBody, setupValues, updateBody } from '../../setup/setup-model';
import { type MaterialsArray, materialGroup, precisionControls } from './settings-controls';

const LEVEL_1 = { name: 'Level 1', claimRepeatability: 0.12, claimWithinLab: 0.2, claimAs: 'sd' as const, assignedValue: 5.2, assignedUncertainty: 0.05, assignedSource: 'certificate' };
const LEVEL_2 = { name: 'Level 2', claimRepeatability: 1.5, claimWithinLab: 2.5, claimAs: 'cv' as const, assignedValue: null, assignedUncertainty: null, assignedSource: '' };

function precisionStudy(own: Partial<PrecisionSettings>): Study {
  return {
    kind: 'precision', title: 'Glucose precision', purpose: '', analyte: { id: 3, name: 'Glucose' }, comparativeInstrument: null, candidateInstrument: null,
    instrument: { id: 4, name: 'Line 1' }, settings: { ...StudySettings.parse({ seed: 'abc', unit: 'mmol/L' }), ...PrecisionSettings.parse(own) },
  } as unknown as Study;
}
const own = (form: ReturnType<typeof buildSetupForm>) => form.controls.settings as unknown as OpenSettingsGroup;

describe('the Setup controls of a precision study', () => {
  it('start a new study with 5 days × 5 replicates, α = 0.05 and one empty material', () => {
    const controls = precisionControls({});
    expect(Object.keys(controls)).toEqual(['materials', 'days', 'replicates', 'alpha', 'controlLot']);
    expect(controls['materials'].value).toEqual([
      { name: '', claimRepeatability: null, claimWithinLab: null, claimAs: 'sd', assignedValue: null, assignedUncertainty: null, assignedSource: '' },
    ]);
    expect([controls['days'].value, controls['replicates'].value, controls['alpha'].value, controls['controlLot'].value]).toEqual([5, 5, 0.05, '']);
  });

  it("put the shared schema's words under the field they concern", () => {
    const m = materialGroup();
    expect(m.controls.name.errors).toEqual({ rule: 'Give the material a name' });
    expect(m.controls.claimRepeatability.errors).toEqual({ rule: 'The repeatability claim must be a number' });
    m.patchValue({ name: 'Level 1', claimRepeatability: 0.3, claimWithinLab: 0.2 });
    expect(m.controls.name.errors).toBeNull();
    expect(m.controls.claimRepeatability.errors).toBeNull();
    expect(m.controls.claimWithinLab.errors).toEqual({ rule: 'The within-laboratory claim cannot be smaller than the repeatability claim' });
    m.patchValue({ claimWithinLab: 0.4, assignedUncertainty: 0.1 });
    expect(m.controls.claimWithinLab.errors).toBeNull();
    expect(m.controls.assignedValue.errors).toEqual({ rule: 'Give the assigned value with its uncertainty' });
    m.patchValue({ assignedValue: 5 });
    expect(m.valid).toBe(true);
  });

  it('refuse two materials of one name, and a design the schema refuses', () => {
    const controls = precisionControls({ materials: [LEVEL_1, { ...LEVEL_2, name: ' level 1' }] });
    expect(controls['materials'].errors).toEqual({ rule: 'Give each material its own name' });
    (controls['materials'] as MaterialsArray).at(1).controls.name.setValue('Level 2');
    expect(controls['materials'].errors).toBeNull();
    controls['days'].setValue(1);
    expect(controls['days'].errors).toEqual({ rule: 'Plan at least 2 days' });
    controls['replicates'].setValue(null);
    expect(controls['replicates'].errors).toEqual({ rule: 'Enter a number here' });
    controls['alpha'].setValue(0.5);
    expect(controls['alpha'].errors).toEqual({ rule: 'α must be at most 0.2' });
  });
});

describe('the Setup form of a precision study', () => {
  it('brings a saved study its materials, design and control lot, and sends them back in the bodies', () => {
    const study = precisionStudy({ materials: [LEVEL_1, LEVEL_2], days: 3, replicates: 4, alpha: 0.01, controlLot: 'QC-7' });
    const form = buildSetupForm(setupValues(study, 'unused'), precisionControls);
    expect(own(form).get('materials')).toBeInstanceOf(FormArray);
    expect((own(form).get('materials') as MaterialsArray).length).toBe(2);
    expect(form.valid).toBe(true);

    const body = updateBody(readSetup(form), '');
    expect(body.settings).toMatchObject({ materials: [LEVEL_1, LEVEL_2], days: 3, replicates: 4, alpha: 0.01, controlLot: 'QC-7' });
    expect(body).toMatchObject({ instrumentId: 4 });
    expect(body).not.toHaveProperty('comparativeInstrumentId');
    expect(UpdateStudyBody.safeParse({ ...body, version: 1 }).success).toBe(true);
    expect(PrecisionSettings.safeParse(body.settings).success).toBe(true);
  });

  it('sends a new precision study with its own settings and its one instrument', () => {
    const values = { ...setupValues(null, 'seed1'), kind: 'precision' as const, title: 'Precision', analyteId: 3, instrumentId: 4, comparativeInstrumentId: 1 };
    const form = buildSetupForm(values, precisionControls);
    (own(form).get('materials') as MaterialsArray).at(0).patchValue(LEVEL_1);
    const body = createBody(readSetup(form));
    expect(body).toMatchObject({ kind: 'precision', instrumentId: 4 });
    expect(body).not.toHaveProperty('comparativeInstrumentId');
    expect(body.settings).toMatchObject({ materials: [LEVEL_1], days: 5, replicates: 5, alpha: 0.05, controlLot: '' });
    expect(CreateStudyBody.safeParse(body).success).toBe(true);
  });

  it('rebuilds the materials from the study on a reset, as many as it has, and takes out another kind’s own settings', () => {
    const form = buildSetupForm(setupValues(precisionStudy({ materials: [LEVEL_1] }), 'unused'), precisionControls);
    resetSetupForm(form, setupValues(precisionStudy({ materials: [LEVEL_1, LEVEL_2] }), 'unused'), precisionControls);
    expect((own(form).get('materials') as MaterialsArray).getRawValue()).toEqual([LEVEL_1, LEVEL_2]);
    expect(form.pristine).toBe(true);

    const other = { ...setupValues(null, 'abc'), kind: 'method-comparison' as const };
    resetSetupForm(form, other);
    expect(Object.keys(own(form).controls).filter((k) => !Object.hasOwn(StudySettings.shape, k))).toEqual([]);
  });

  it('keeps a read-only form read-only when a reset brings the own settings', () => {
    const form = buildSetupForm(setupValues(null, 'abc'));
    form.disable();
    resetSetupForm(form, setupValues(precisionStudy({ materials: [LEVEL_1] }), 'unused'), precisionControls);
    expect(own(form).get('materials')?.disabled).toBe(true);
    expect(form.controls.settings.disabled).toBe(true);
  });

  it('checks an own setting of a kind without controls of its own with the kind’s schema', () => {
    const values = setupValues(precisionStudy({ materials: [LEVEL_1] }), 'unused');
    const form = buildSetupForm(values);
    const days = own(form).get('days') as FormControl;
    days.setValue(100);
    expect(days.errors).toEqual({ rule: 'At most 60 days' });
  });
});
