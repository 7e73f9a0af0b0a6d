import type { ComparisonResolution, Resolution } from '../stats/resolution';
import { judgedOnSentence, narrowCiNote, narrowCiNotes, narrowCiSentence, resolutionRule, stepFigure } from './resolution-words';

const sodium = (limitedEstimates: string[], more: Partial<ComparisonResolution> = {}): ComparisonResolution => ({
  increment: 1, source: 'analyte', limitedEstimates, differenceIncrement: 1, slopeIncrement: 1 / 33, ...more,
});

describe('reporting-step wording', () => {
  it('writes a step in plain figures, two significant digits at most', () => {
    expect([1, 0.1, 0.01, 0.5, 10, 1000, 1 / 33, 100 / 140, 0.05].map(stepFigure)).toEqual(['1', '0.1', '0.01', '0.5', '10', '1000', '0.03', '0.71', '0.05']);
  });

  it('says beside an estimate that its CI is narrower than one step and what that means', () => {
    expect(narrowCiNote('1 mmol/L')).toBe('CI narrower than one reporting step (1 mmol/L): the data cannot show a difference finer than the step.');
    expect(narrowCiSentence('1 mmol/L')).toBe('The CI is narrower than one reporting step (1 mmol/L): the data cannot show a difference finer than the step.');
  });

  it('names each limited estimate with the step in its own unit: results, differences in %, the slope', () => {
    const notes = narrowCiNotes(sodium(['bias.median', 'regression.slope', 'regression.intercept', 'decisionLevels.1'], { differenceIncrement: 100 / 140 }), 'mmol/L', '%');
    expect(Object.keys(notes)).toEqual(['bias.median', 'regression.slope', 'regression.intercept', 'decisionLevels.1']);
    expect(notes['bias.median']).toContain('(0.71 %)');
    expect(notes['regression.slope']).toContain('(0.03 on the slope)');
    expect(notes['regression.intercept']).toContain('(1 mmol/L)');
    expect(notes['decisionLevels.1']).toBe(narrowCiNote('1 mmol/L'));
  });

  it('gives no notes and no rule for fine-grained data or results stored before the engine reported its step', () => {
    expect(narrowCiNotes(sodium([]), 'mmol/L')).toEqual({});
    expect(resolutionRule(sodium([]), 'mmol/L')).toBeNull();
    expect(narrowCiNotes(undefined, 'mmol/L')).toEqual({});
    expect(resolutionRule(undefined, 'mmol/L')).toBeNull();
    expect(resolutionRule(null, 'mmol/L')).toBeNull();
  });

  it('states the rule for a comparison once, with the step, where it came from and half a step', () => {
    expect(resolutionRule(sodium(['bias.median']), 'mmol/L')).toBe(
      "Results are reported in steps of 1 mmol/L (from the analyte's decimals). A confidence interval narrower than one step says nothing finer than the step; " +
        'a decision-level verdict is judged on an interval no narrower than the estimate ± half a step (0.5 mmol/L).',
    );
    expect(resolutionRule(sodium(['sd'], { source: 'data', increment: 0.1 }), 'mmol/L')).toMatch(/^Results are reported in steps of 0\.1 mmol\/L \(detected from the data\)\..*\(0\.05 mmol\/L\)\.$/);
  });

  it('adds the step of a percent difference and of the slope to the rule when those estimates are limited', () => {
    const rule = resolutionRule(sodium(['bias.mean', 'regression.slope'], { differenceIncrement: 100 / 140 }), 'mmol/L', '%');
    expect(rule).toContain('For the percent differences one step is 0.71 % (one step at the median pair mean).');
    expect(rule).toContain('On the slope one step is 0.03 (a change that moves the line by one step across the comparative range).');
    expect(resolutionRule(sodium(['bias.mean']), 'mmol/L')).not.toContain('slope');
  });

  it('states the rule for a reference interval without decision levels', () => {
    const interval: Resolution = { increment: 1, source: 'data', limitedEstimates: ['upper'] };
    expect(resolutionRule(interval, 'mmol/L')).toBe(
      'Results are reported in steps of 1 mmol/L (detected from the data). A confidence interval narrower than one step says nothing finer than the step.',
    );
  });

  it('says on what interval a decision level was judged and why', () => {
    expect(judgedOnSentence('0.50 to 1.50 mmol/L', '1 mmol/L')).toBe(
      'The CI is narrower than one reporting step (1 mmol/L), so the verdict is judged on 0.50 to 1.50 mmol/L (the CI widened to the estimate ± half a step)',
    );
  });
});
