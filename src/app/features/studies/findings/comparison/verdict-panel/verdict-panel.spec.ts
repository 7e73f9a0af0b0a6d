import { fineGrained, renderFindings, sodiumComparison, storedBeforeResolution } from '../../../../../../testing/coarse-results';
import type { ComparisonFindingsResult } from '../comparison-result';
import { VerdictPanel } from './verdict-panel';

const NARROW = 'CI narrower than one reporting step (1 mmol/L): the data cannot show a difference finer than the step.';

async function render(result: ComparisonFindingsResult) {
  const root = await renderFindings(VerdictPanel, result);
  const text = (id: string): string | null => root.querySelector(`[data-testid="${id}"]`)?.textContent?.replace(/\s+/g, ' ').trim() ?? null;
  return { root, text };
}

describe('VerdictPanel with results reported in whole steps', () => {
  it('states the rule of the reporting step once, at the top of the verdict', async () => {
    const { root } = await render(sodiumComparison());
    expect(root.querySelector('[data-testid="resolution-rule"] span')!.textContent).toBe(
      "Results are reported in steps of 1 mmol/L (from the analyte's decimals). A confidence interval narrower than one step says nothing finer than the step; " +
        'a decision-level verdict is judged on an interval no narrower than the estimate ± half a step (0.5 mmol/L). ' +
        'On the slope one step is 0.03 (a change that moves the line by one step across the comparative range).',
    );
    expect(root.querySelectorAll('[data-testid="resolution-rule"]')).toHaveLength(1);
    expect(root.querySelector('[data-testid="resolution-rule"]')!.compareDocumentPosition(root.querySelector('table')!) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
  });

  it('says beside each decision level that its CI is narrower than the step and on what the verdict was judged', async () => {
    const { text } = await render(sodiumComparison());
    for (const k of [0, 1]) expect(text(`step-note-decisionLevels.${k}`)).toBe(`${NARROW} Verdict judged on 0.5 to 1.5 mmol/L.`);
    expect(text('verdict-sentences')).toContain(
      'At 130 mmol/L the predicted bias is 1.0 mmol/L (95% CI 1.0 to 1.0). The CI is narrower than one reporting step (1 mmol/L), so the verdict is judged on 0.5 to 1.5 mmol/L',
    );
    expect(text('median-bias')).toContain('The CI is narrower than one reporting step (1 mmol/L): the data cannot show a difference finer than the step.');
  });

  it.each([
    ['fine-grained data', fineGrained(sodiumComparison())],
    ['results stored by engine 1.1.0', storedBeforeResolution(sodiumComparison())],
  ])('shows no word of the step for %s', async (_name, result) => {
    const { root, text } = await render(result);
    expect(text('resolution-rule')).toBeNull();
    expect(root.querySelectorAll('.step-note')).toHaveLength(0);
    expect(root.textContent).not.toContain('step');
    expect(text('verdict-sentences')).toContain('(95% CI 1.0 to 1.0): the whole CI lies within the allowable ±2.0 mmol/L.');
  });
});
