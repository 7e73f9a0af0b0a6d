import { FormArray } from '@angular/forms';
import { RangeSettings } from '@shared/kinds/reportable-range/meta';
import { CreateStudyBody, StudySettings, UpdateStudyBody, type Study } from '@shared/schemas';
import { buildSetupForm, readSetup, resetSetupForm, type OpenSettingsGroup } from '../../setup/setup-form-group';
import { createBody, setupValues, updateBody } from '../../setup/setup-model';
import { type LevelsArray, evenFractions, levelGroup, rangeControls } from './settings-controls';

const FRACTIONS = [0, 0.25, 0.5, 0.75, 1].map((fraction, i) => ({ name: `Level ${i + 1}`, assigned: null, fraction }));
const ASSIGNED = [2, 8, 14, 20, 26, 32].map((assigned, i) => ({ name: `L${i + 1}`, assigned, fraction: null }));

function rangeStudy(own: Partial<RangeSettings>): Study {
  return {
    kind: 'reportable-range', title: 'Glucose range', purpose: '', analyte: { id: 3, name: 'Glucose' }, comparativeInstrument: null, candidateInstrument: null,
    instrument: { id: 4, name: 'Line 1' }, settings: { ...StudySettings.parse({ seed: 'abc', unit: 'mmol/L' }), ...RangeSettings.parse(own) },
  } as unknown as Study;
}
const own = (form: ReturnType<typeof buildSetupForm>) => form.controls.settings as unknown as OpenSettingsGroup;

describe('the Setup controls of a reportable-range study', () => {
  it('start a new study with five named levels to value, 2 replicates, α = 0.05 and no goal, pools or claim', () => {
    const controls = rangeControls({});
    expect(Object.keys(controls)).toEqual([
      'levels', 'poolLow', 'poolHigh', 'replicates', 'allowableNonlinearity', 'allowableNonlinearityPercent', 'nonlinearitySource', 'claimedLow', 'claimedHigh', 'alpha',
    ]);
    expect(controls['levels'].value).toEqual([1, 2, 3, 4, 5].map((k) => ({ name: `Level ${k}`, assigned: null, fraction: null })));
    expect(Object.fromEntries(Object.entries(controls).filter(([k]) => k !== 'levels').map(([k, c]) => [k, c.value]))).toEqual({
      poolLow: null, poolHigh: null, replicates: 2, allowableNonlinearity: null, allowableNonlinearityPercent: null, nonlinearitySource: '',
      claimedLow: null, claimedHigh: null, alpha: 0.05,
    });
  });

  it("put a level's errors in the shared schema's words under the field they concern", () => {
    const l = levelGroup();
    expect(l.controls.name.errors).toEqual({ rule: 'Give the level a name' });
    expect(l.controls.assigned.errors).toEqual({ rule: 'Give the level either an assigned value or a mixing fraction, not both' });
    l.patchValue({ name: 'Level 1', assigned: 5, fraction: 0.5 });
    expect(l.controls.name.errors).toBeNull();
    expect(l.controls.assigned.errors).toEqual({ rule: 'Give the level either an assigned value or a mixing fraction, not both' });
    l.patchValue({ assigned: null, fraction: 1.5 });
    expect(l.controls.assigned.errors).toBeNull();
    expect(l.controls.fraction.errors).toEqual({ rule: 'The mixing fraction must be from 0 to 1' });
    l.patchValue({ fraction: 1 });
    expect(l.valid).toBe(true);
  });

  it('refuse two levels of one name and more than 11 levels', () => {
    const controls = rangeControls({ levels: [...ASSIGNED.slice(0, 4), { ...ASSIGNED[4], name: ' l1' }] });
    expect(controls['levels'].errors).toEqual({ rule: 'Give each level its own name' });
    (controls['levels'] as LevelsArray).at(4).controls.name.setValue('L5');
    expect(controls['levels'].errors).toBeNull();
    const levels = controls['levels'] as LevelsArray;
    for (let k = 6; k <= 12; k++) levels.push(levelGroup({ name: `L${k}`, assigned: k }));
    expect(levels.errors).toEqual({ rule: 'At most 11 levels' });
  });

  it('check each number with the shared schema, in words naming the field', () => {
    const controls = rangeControls({});
    controls['replicates'].setValue(null);
    expect(controls['replicates'].errors).toEqual({ rule: 'Enter a number here' });
    controls['replicates'].setValue(11);
    expect(controls['replicates'].errors).toEqual({ rule: 'At most 10 replicates a level' });
    controls['allowableNonlinearity'].setValue(0);
    expect(controls['allowableNonlinearity'].errors).toEqual({ rule: 'The allowable nonlinearity must be above 0' });
    controls['allowableNonlinearityPercent'].setValue(120);
    expect(controls['allowableNonlinearityPercent'].errors).toEqual({ rule: 'The allowable nonlinearity in % must be at most 100' });
    controls['alpha'].setValue(0.5);
    expect(controls['alpha'].errors).toEqual({ rule: 'α must be at most 0.2' });
  });

  it('check the rules joining two fields, again whenever either changes', () => {
    const controls = rangeControls({ levels: FRACTIONS });
    expect(controls['poolLow'].errors).toBeNull();
    controls['poolLow'].setValue(2);
    expect(controls['poolHigh'].errors).toEqual({ rule: 'Give both pool values or neither' });
    controls['poolHigh'].setValue(1);
    expect(controls['poolHigh'].errors).toEqual({ rule: "The high pool's value must be above the low pool's" });
    controls['poolLow'].setValue(0.5);
    expect(controls['poolHigh'].errors).toBeNull();

    controls['claimedLow'].setValue(30);
    controls['claimedHigh'].setValue(2);
    expect(controls['claimedHigh'].errors).toEqual({ rule: 'The claimed high end must be above the claimed low end' });
    controls['claimedLow'].setValue(1);
    expect(controls['claimedHigh'].errors).toBeNull();
  });

  it('ask for the pools when some levels are fractions and others assigned values, until every level is a fraction', () => {
    const controls = rangeControls({ levels: FRACTIONS });
    const levels = controls['levels'] as LevelsArray;
    levels.at(2).patchValue({ assigned: 12, fraction: null });
    expect(controls['poolLow'].errors).toEqual({ rule: 'Levels given as mixing fractions need both pool values, unless every level is a mixing fraction' });
    levels.at(2).patchValue({ assigned: null, fraction: 0.5 });
    expect(controls['poolLow'].errors).toBeNull();
  });

  it('count a field the schema refuses as its default in the joined rules, so its own words stand alone', () => {
    const controls = rangeControls({ levels: FRACTIONS });
    controls['replicates'].setValue(null);
    controls['claimedLow'].setValue(30);
    controls['claimedHigh'].setValue(2);
    expect(controls['replicates'].errors).toEqual({ rule: 'Enter a number here' });
    expect(controls['claimedHigh'].errors).toEqual({ rule: 'The claimed high end must be above the claimed low end' });
  });

  it('give even fractions of the high pool to 4 decimals', () => {
    expect(evenFractions(5)).toEqual([0, 0.25, 0.5, 0.75, 1]);
    expect(evenFractions(7)).toEqual([0, 0.1667, 0.3333, 0.5, 0.6667, 0.8333, 1]);
    expect(evenFractions(11)).toEqual([0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1]);
    expect(evenFractions(1)).toEqual([]);
  });
});

describe('the Setup form of a reportable-range study', () => {
  const SAVED = { levels: ASSIGNED, replicates: 3, allowableNonlinearity: 0.3, allowableNonlinearityPercent: 2, nonlinearitySource: 'Lab policy', claimedLow: 2, claimedHigh: 32, alpha: 0.01 };

  it('brings a saved study its levels, design, goal and claim, and sends them back in the bodies', () => {
    const form = buildSetupForm(setupValues(rangeStudy(SAVED), 'unused'), rangeControls);
    expect(own(form).get('levels')).toBeInstanceOf(FormArray);
    expect((own(form).get('levels') as LevelsArray).length).toBe(6);
    expect(form.valid).toBe(true);

    const body = updateBody(readSetup(form), '');
    expect(body.settings).toMatchObject({ ...SAVED, poolLow: null, poolHigh: null });
    expect(body).toMatchObject({ instrumentId: 4 });
    expect(body).not.toHaveProperty('comparativeInstrumentId');
    expect(UpdateStudyBody.safeParse({ ...body, version: 1 }).success).toBe(true);
    expect(RangeSettings.safeParse(body.settings).success).toBe(true);
  });

  it('is invalid while a joined rule fails, and valid once it is mended', () => {
    const form = buildSetupForm(setupValues(rangeStudy({ ...SAVED, levels: FRACTIONS }), 'unused'), rangeControls);
    expect(form.valid).toBe(true);
    own(form).get('poolLow')!.setValue(1);
    expect(form.valid).toBe(false);
    own(form).get('poolHigh')!.setValue(40);
    expect(form.valid).toBe(true);
  });

  it('sends a new study with its own settings and its one instrument', () => {
    const values = { ...setupValues(null, 'seed1'), kind: 'reportable-range' as const, title: 'Range', analyteId: 3, instrumentId: 4, comparativeInstrumentId: 1 };
    const form = buildSetupForm(values, rangeControls);
    (own(form).get('levels') as LevelsArray).controls.forEach((l, k) => l.patchValue({ fraction: FRACTIONS[k].fraction }));
    own(form).get('allowableNonlinearity')!.setValue(0.2);
    const body = createBody(readSetup(form));
    expect(body).toMatchObject({ kind: 'reportable-range', instrumentId: 4 });
    expect(body).not.toHaveProperty('comparativeInstrumentId');
    expect(body.settings).toMatchObject({ levels: FRACTIONS, replicates: 2, alpha: 0.05, allowableNonlinearity: 0.2, poolLow: null, poolHigh: null });
    expect(CreateStudyBody.safeParse(body).success).toBe(true);
  });

  it('rebuilds the levels from the study on a reset, as many as it has', () => {
    const form = buildSetupForm(setupValues(rangeStudy({ levels: FRACTIONS }), 'unused'), rangeControls);
    resetSetupForm(form, setupValues(rangeStudy(SAVED), 'unused'), rangeControls);
    expect((own(form).get('levels') as LevelsArray).getRawValue()).toEqual(ASSIGNED);
    expect(form.pristine).toBe(true);
    expect(form.valid).toBe(true);
  });
});
