import { SamplePlan } from '@shared/kinds/method-comparison/sample-plan';
import { buildPlanForm, planBody, planValues, samePlan, suggested } from './plan-form';
import { parseGrid } from './plan-grid';
import { issuePlace, withoutPath } from './plan-words';

describe('the numbers of specimens to try', () => {
  it('reads whole numbers separated by commas, semicolons or spaces', () => {
    expect(parseGrid('40, 60;80 100')).toEqual({ values: [40, 60, 80, 100], error: null });
  });

  it('names the entry that is wrong', () => {
    expect(parseGrid('')).toEqual({ values: null, error: 'List at least one number of specimens, e.g. 40, 60, 80' });
    expect(parseGrid('40, 6o').error).toBe('“6o” is not a whole number; write the numbers separated by commas, e.g. 40, 60, 80');
    expect(parseGrid('40.5').error).toContain('“40.5” is not a whole number');
    expect(parseGrid('4, 40').error).toBe('4 is too few: each n must be at least 5');
    expect(parseGrid('2001').error).toBe('2001 is too many: each n must be at most 2,000');
    expect(parseGrid('40, 40').error).toBe('40 is listed twice');
    expect(parseGrid(Array.from({ length: 13 }, (_, i) => 10 + i).join(',')).error).toBe('List at most 12 numbers of specimens (13 given)');
  });
});

describe('the plan form', () => {
  const saved: SamplePlan = {
    errorModel: 'constant', cvComparative: 0.1, cvCandidate: 0.12, low: 3, high: 20, shape: 'log-uniform', earlierStudyId: null,
    n: [40, 80], simulations: 500, targetPower: 0.9, maxFalsePass: 0.025,
  };

  it('starts a new plan from the shared defaults, the targets in %', () => {
    expect(planValues(null)).toEqual({
      errorModel: 'proportional', cvComparative: null, cvCandidate: null, low: null, high: null, shape: 'uniform', earlierStudyId: null,
      n: '40, 60, 80, 100, 120, 160, 200', simulations: 1000, targetPower: 80, maxFalsePass: 5,
    });
  });

  it('gives back a saved plan unchanged after a trip through the fields', () => {
    expect(planValues(saved)).toMatchObject({ n: '40, 80', targetPower: 90, maxFalsePass: 2.5 });
    expect(planBody(planValues(saved))).toEqual(saved);
    expect(samePlan(planBody(planValues(saved)), saved)).toBe(true);
    expect(samePlan({ ...saved, simulations: 1000 }, saved)).toBe(false);
    expect(samePlan(null, saved)).toBe(false);
  });

  it('sends an empty number as NaN so the shared schema names its field, and keeps the range out of an earlier study', () => {
    const body = planBody({ ...planValues(saved), cvComparative: null });
    expect(body.cvComparative).toBeNaN();
    expect(SamplePlan.safeParse(body).error?.issues[0].path).toEqual(['cvComparative']);
    const earlier = planBody({ ...planValues(null), cvComparative: 2, cvCandidate: 2, shape: 'earlier-study', earlierStudyId: 12 });
    expect(earlier).toMatchObject({ shape: 'earlier-study', earlierStudyId: 12, low: 0, high: 0 });
    expect(SamplePlan.safeParse(earlier).success).toBe(true);
    expect(planBody({ ...planValues(saved), shape: 'uniform', earlierStudyId: 12 }).earlierStudyId).toBeNull();
  });

  it('checks each field with the shared rule, the targets as the fractions they stand for', () => {
    const form = buildPlanForm({ ...planValues(saved), targetPower: 40, maxFalsePass: 60, simulations: 50, n: '3' });
    expect(form.controls.targetPower.errors).toEqual({ rule: 'The target power must be at least 50%' });
    expect(form.controls.maxFalsePass.errors).toEqual({ rule: 'The false-pass limit must be at most 50%' });
    expect(form.controls.simulations.errors).toEqual({ rule: 'At least 100 simulated studies' });
    expect(form.controls.n.errors).toEqual({ rule: '3 is too few: each n must be at least 5' });
    expect(buildPlanForm(planValues(null)).controls.cvComparative.errors).toEqual({ rule: 'Enter a number here' });
  });

  it('suggests the largest CV under the proportional model and the largest SD under the constant one', () => {
    const found = { studyId: 1, title: 'P', instrument: 'Line 1', signedAt: '', materials: [], cv: 1.8734, sd: 0.12345 };
    expect(suggested(found, 'proportional')).toBe(1.87);
    expect(suggested(found, 'constant')).toBe(0.123);
    expect(suggested(null, 'constant')).toBeNull();
  });
});

describe('where a refusal is shown', () => {
  const fields = ['low', 'high', 'n', 'earlierStudyId'];

  it('puts a plan field at its field, the reason at the reason, and a Setup field in words', () => {
    expect(issuePlace({ path: 'settings.samplePlan.low', message: 'x' }, fields)).toEqual({ field: 'low' });
    expect(issuePlace({ path: 'settings.samplePlan.n.2', message: 'x' }, fields)).toEqual({ field: 'n' });
    expect(issuePlace({ path: 'reason', message: 'x' }, fields)).toEqual({ reason: true });
    expect(issuePlace({ path: 'settings.allowableBiasAbsolute', message: 'settings.allowableBiasAbsolute: or allowableBiasPercent must be given' }, fields)).toEqual({
      setup: 'Set the allowable bias (± in the unit, ± %, or both) in Setup above: the plan judges the bias against it.',
    });
    expect(issuePlace({ path: 'settings.demingRatio', message: 'settings.demingRatio: must be a positive number' }, fields)).toEqual({
      setup: 'Deming error ratio λ (in Setup above): Must be a positive number',
    });
    expect(issuePlace({ path: 'settings.samplePlan', message: 'Set the plan: the imprecision of each method' }, fields)).toEqual({
      setup: 'Set the plan: the imprecision of each method',
    });
    expect(withoutPath('settings.samplePlan.high: must be a number above low (3)')).toBe('Must be a number above low (3)');
  });
});
