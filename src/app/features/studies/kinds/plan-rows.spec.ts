import { StudySettings, type Study } from '@shared/schemas';
import { allowableBiasText, planRows } from './plan-rows';

const settings = (patch: Partial<StudySettings> = {}): StudySettings => ({ ...StudySettings.parse({}), unit: 'mmol/L', decimals: 1, ...patch });
const study = (kind: Study['kind'], patch: Partial<StudySettings> = {}, n = 40) => ({ kind, n, analyteUnit: 'mmol/L', settings: settings(patch) });
const value = (rows: ReturnType<typeof planRows>, label: string) => rows.find((r) => r.label === label);

describe('allowableBiasText', () => {
  it('writes the absolute goal, the percent goal, or both with the rule the engine applies', () => {
    expect(allowableBiasText(settings({ allowableBiasAbsolute: 0.3 }), 'mmol/L')).toBe('±0.30 mmol/L');
    expect(allowableBiasText(settings({ allowableBiasPercent: 5 }), 'mmol/L')).toBe('±5 % of the decision level');
    expect(allowableBiasText(settings({ allowableBiasAbsolute: 0.3, allowableBiasPercent: 5 }), 'mmol/L'))
      .toBe('±0.30 mmol/L or ±5 % of the decision level, whichever is greater');
    expect(allowableBiasText(settings(), 'mmol/L')).toBe('Not set: no verdict can be given');
  });
});

describe('planRows', () => {
  it('lists a comparison’s levels, goal and its source, rules and specimen count', () => {
    const rows = planRows(study('method-comparison', {
      decisionLevels: [5, 7, 11.1], allowableBiasAbsolute: 0.3, allowableBiasSource: 'Laboratory policy 2026, after the US acceptance limits', plannedSpecimens: 40,
    }));
    expect(value(rows, 'Medical decision levels')).toEqual({ label: 'Medical decision levels', value: '5.0; 7.0; 11.1 mmol/L', missing: false });
    expect(value(rows, 'Source of the allowable bias')?.value).toBe('Laboratory policy 2026, after the US acceptance limits');
    expect(value(rows, 'Specimens')?.value).toBe('40 planned; 40 included');
    expect(value(rows, 'Regression')?.value).toBe('Passing–Bablok');
    expect(value(rows, 'Bootstrap')?.value).toBe('10,000 resamples, percentile bootstrap, 95% CIs, seed parallax');
    expect(rows.filter((r) => r.missing)).toEqual([]);
  });

  it('marks what sign-off needs but the plan lacks, and fewer specimens than planned', () => {
    const rows = planRows(study('method-comparison', { plannedSpecimens: 60 }));
    expect(rows.filter((r) => r.missing).map((r) => r.label)).toEqual(['Medical decision levels', 'Allowable bias', 'Source of the allowable bias', 'Specimens']);
    expect(value(rows, 'Source of the allowable bias')?.value).toBe('Not given');
  });

  it('sums up the plan by simulation, or says it is not set', () => {
    expect(value(planRows(study('method-comparison')), 'Plan by simulation')?.value).toBe('Not set');
    const samplePlan = { errorModel: 'proportional', cvComparative: 2, cvCandidate: 2.5, low: 3, high: 20, shape: 'uniform', earlierStudyId: null, n: [40, 80], simulations: 1000, targetPower: 0.8, maxFalsePass: 0.05 };
    const rows = planRows(study('method-comparison', { samplePlan } as Partial<StudySettings>));
    expect(value(rows, 'Plan by simulation')?.value)
      .toBe('CV 2% (comparative) and 2.5% (candidate); values 3 to 20 mmol/L, even across the range; n = 40, 80; 1,000 simulated studies each; targets 80% power, at most 5% false passes');
  });

  it('names the Deming error ratio when the regression uses it', () => {
    expect(value(planRows(study('method-comparison', { regression: 'deming', demingRatio: 1.5 })), 'Regression')?.value).toBe('Deming, error ratio λ = 1.5');
  });

  it('lists a verification’s stated interval and its source', () => {
    const rows = planRows(study('interval-verify', { statedLower: 3.9, statedUpper: 6.1, statedSource: 'Package insert, lot 24A' }, 20));
    expect(value(rows, 'Stated reference interval')?.value).toBe('3.9 to 6.1 mmol/L');
    expect(value(rows, 'Source of the stated interval')?.value).toBe('Package insert, lot 24A');
    expect(planRows(study('interval-verify')).find((r) => r.label === 'Stated reference interval')?.missing).toBe(true);
  });

  it('lists an establishment’s population, percentiles and partitions', () => {
    const rows = planRows(study('interval-establish', { populationDescription: 'Healthy blood donors', partitionFields: ['sex', 'ageBand'] }, 240));
    expect(value(rows, 'Percentiles')?.value).toBe('2.5th–97.5th percentiles');
    expect(value(rows, 'Method')?.value).toMatch(/^Nonparametric: /);
    expect(value(rows, 'Partitions tested')?.value).toBe('sex, age band');
  });
});
