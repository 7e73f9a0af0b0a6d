import type { Analyte, Study } from '@shared/schemas';
import { StudySettings } from '@shared/schemas';
import { createBody, randomSeed, settingsFromAnalyte, setupValues, updateBody } from './setup-model';

const glucose: Analyte = {
  id: 3, name: 'Glucose', unit: 'mmol/L', decimals: 1, decisionLevels: [2.8, 7, 11.1], allowableBiasAbsolute: 0.2,
  allowableBiasPercent: 4, allowableBiasSource: 'Laboratory policy', canBeNegative: false, active: true,
};

describe('setup model', () => {
  it('starts a new study with the schema defaults and the seed it was given', () => {
    const values = setupValues(null, 'c0ffee123456');
    expect(values.kind).toBe('method-comparison');
    expect(values.settings.seed).toBe('c0ffee123456');
    expect(values.settings.resamples).toBe(10000);
    expect(values.settings.regression).toBe('passing-bablok');
    expect(values.settings.decisionLevels).toBe('');
  });

  it('makes a random seed of 12 hexadecimal digits from the random source', () => {
    expect(randomSeed((b) => b.fill(171))).toBe('abababababab');
    expect(randomSeed()).toMatch(/^[0-9a-f]{12}$/);
  });

  it("brings the analyte's unit, decision levels and allowable bias with its source", () => {
    expect(settingsFromAnalyte(glucose)).toEqual({
      unit: 'mmol/L', decimals: 1, decisionLevels: '2.8, 7, 11.1', allowableBiasAbsolute: 0.2, allowableBiasPercent: 4,
      allowableBiasSource: 'Laboratory policy',
    });
  });

  it('builds the create body with the instruments of a comparison and the levels as numbers', () => {
    const values = setupValues(null, 'seed1');
    values.title = '  Glucose on line 2 ';
    values.analyteId = 3;
    values.comparativeInstrumentId = 1;
    values.candidateInstrumentId = 2;
    values.instrumentId = 9;
    values.settings = { ...values.settings, ...settingsFromAnalyte(glucose) };
    const body = createBody(values);
    expect(body).toMatchObject({ kind: 'method-comparison', title: 'Glucose on line 2', analyteId: 3, comparativeInstrumentId: 1, candidateInstrumentId: 2 });
    expect(body).not.toHaveProperty('instrumentId');
    expect(body.settings?.decisionLevels).toEqual([2.8, 7, 11.1]);
    expect(StudySettings.safeParse(body.settings).success).toBe(true);
  });

  it('lets the shared schema name an empty or unreadable number instead of sending a default', () => {
    const values = setupValues(null, 'seed1');
    values.settings = { ...values.settings, resamples: null, decisionLevels: '7, x' };
    const result = StudySettings.safeParse(createBody(values).settings);
    expect(result.success).toBe(false);
    const paths = result.error?.issues.map((i) => i.path.join('.'));
    expect(paths).toEqual(expect.arrayContaining(['resamples', 'decisionLevels.0']));
  });

  it('round-trips a stored study and adds a reason only when one is given', () => {
    const settings = StudySettings.parse({ decisionLevels: [7], seed: 'abc', regression: 'deming', demingRatio: 1.5 });
    const study = {
      kind: 'method-comparison', title: 'T', purpose: 'P', analyte: { id: 3, name: 'Glucose' },
      comparativeInstrument: { id: 1, name: 'A' }, candidateInstrument: { id: 2, name: 'B' }, instrument: null, settings,
    } as unknown as Study;
    const body = updateBody(setupValues(study, 'unused'), '');
    expect(body).toMatchObject({ title: 'T', analyteId: 3, comparativeInstrumentId: 1, candidateInstrumentId: 2 });
    expect(body.settings).toEqual(settings);
    expect(body).not.toHaveProperty('reason');
    expect(updateBody(setupValues(study, 'unused'), ' plan revised ').reason).toBe('plan revised');
  });
});
