import { fineGrained, renderFindings, sodiumComparison, storedBeforeResolution } from '../../../../../../testing/coarse-results';
import type { ComparisonFindingsResult } from '../comparison-result';
import { EstimateTables } from './estimate-tables';

const TAIL = ': the data cannot show a difference finer than the step.';

async function render(result: ComparisonFindingsResult) {
  return renderFindings(EstimateTables, result);
}

/** Each note row of a table with the name of the estimate in the row just above it. */
const notesOf = (table: Element): [string, string][] =>
  [...table.querySelectorAll('tr.step-note')].map((tr) => [
    tr.previousElementSibling!.querySelector('th')!.textContent!.trim(),
    tr.textContent!.replace(/\s+/g, ' ').trim(),
  ]);

describe('EstimateTables with results reported in whole steps', () => {
  it('puts the words right under each estimate whose CI is narrower than one step, in its own unit', async () => {
    const root = await render(sodiumComparison());
    expect(notesOf(root.querySelector('[data-testid="agreement-table"]')!)).toEqual([
      ['Median bias', `CI narrower than one reporting step (1 mmol/L)${TAIL}`],
    ]);
    const regression = root.querySelector('[data-testid="regression-section"]')!;
    expect(regression.querySelector('[data-testid="regression-slope-step"]')!.textContent!.trim()).toBe(`CI narrower than one reporting step (0.03 on the slope)${TAIL}`);
    expect(regression.querySelector('[data-testid="regression-intercept-step"]')!.textContent!.trim()).toBe(`CI narrower than one reporting step (1 mmol/L)${TAIL}`);
    expect(regression.querySelector('[data-testid="regression-linearity-step"]')).toBeNull();
  });

  it.each([
    ['fine-grained data', fineGrained(sodiumComparison())],
    ['results stored by engine 1.1.0', storedBeforeResolution(sodiumComparison())],
  ])('adds no note for %s', async (_name, result) => {
    const root = await render(result);
    expect(root.querySelectorAll('tr.step-note, .step-note')).toHaveLength(0);
    expect(root.textContent).not.toContain('reporting step');
  });
});

/** The text of an element with its white space closed up. */
const text = (root: Element, testId: string): string => root.querySelector(`[data-testid="${testId}"]`)!.textContent!.replace(/\s+/g, ' ').trim();

describe('EstimateTables: the regression as an answer to how the candidate reads across the range', () => {
  it('puts the heading, the method, slope and intercept in words, the linearity sentence and r as details, in that order', async () => {
    const root = await render(fineGrained(sodiumComparison()));
    const section = root.querySelector('[data-testid="regression-section"]')!;
    expect(section.querySelector('h2')!.textContent).toBe('How the candidate reads across the range');
    expect(text(root, 'regression-method')).toBe('Passing–Bablok regression of the candidate (y) on the comparative method (x); 95% CIs of slope and intercept: rank-based (Passing & Bablok 1983).');
    expect([...section.querySelectorAll('dt')].map((dt) => dt.textContent!.trim())).toEqual(['Per unit (slope)', 'Offset (intercept)', 'Straight line (linearity)']);
    expect(text(root, 'regression-slope')).toBe('Per unit (slope) The candidate reads neither higher nor lower per unit (slope 1.000, 95% CI 1.000 to 1.000, that is 0.0% to 0.0%). The CI includes 1: a proportional difference is not shown.');
    expect(text(root, 'regression-intercept')).toContain('At zero the candidate reads 1.0 mmol/L higher, a constant offset (intercept 1.0 mmol/L, 95% CI 1.0 to 1.0 mmol/L). The CI excludes 0');
    expect(text(root, 'regression-linearity')).toContain('The cusum test for linearity of Passing–Bablok finds no departure from a straight line (p = 0.600)');
    expect(text(root, 'regression-details')).toBe('Details: Pearson r = 0.9800, for reference only: a high r shows the range was wide, not that the methods agree; agreement is judged from the bias and its CI.');
    const order = [...root.querySelectorAll('section h2')].map((h) => h.textContent);
    expect(order).toEqual(['Bias and agreement', 'How the candidate reads across the range', 'Tests of the differences against zero']);
  });

  it('no longer prints the regression as a table of slope, intercept, linearity and r', async () => {
    const root = await render(sodiumComparison());
    expect(root.querySelector('[data-testid="regression-section"] table')).toBeNull();
    expect(root.textContent).not.toContain('Correlation r (for reference only)');
  });
});
