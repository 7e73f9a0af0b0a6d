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
    expect(notesOf(root.querySelector('[data-testid="regression-table"]')!)).toEqual([
      ['Slope', `CI narrower than one reporting step (0.03 on the slope)${TAIL}`],
      ['Intercept', `CI narrower than one reporting step (1 mmol/L)${TAIL}`],
    ]);
  });

  it.each([
    ['fine-grained data', fineGrained(sodiumComparison())],
    ['results stored by engine 1.1.0', storedBeforeResolution(sodiumComparison())],
  ])('adds no note for %s', async (_name, result) => {
    const root = await render(result);
    expect(root.querySelectorAll('tr.step-note')).toHaveLength(0);
    expect(root.textContent).not.toContain('reporting step');
  });
});
