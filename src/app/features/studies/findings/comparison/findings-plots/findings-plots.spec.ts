import { TestBed } from '@angular/core/testing';
import { StudySettings } from '@shared/schemas';
import { noAnimations } from '../../../../../../testing/http';
import { GLUCOSE_SETTINGS, engineComparison, glucoseFindings, glucoseStudy } from '../../../../../../testing/engine-findings';
import { plotPoints } from '../../charts/plot-points';
import { COMPARISON_LAYOUT, fromStored } from '../../../specimens/specimen-layout';
import { ComparisonFindingsResult, unitsOf } from '../comparison-result';
import { FindingsPlots } from './findings-plots';

/** The plots of engine findings for the glucose rows; `drawn` false renders them as for rows changed since the analysis. */
async function render(result: ComparisonFindingsResult, drawn = true) {
  TestBed.configureTestingModule({ providers: [noAnimations] });
  const rows = glucoseFindings().rows.map((r) => fromStored(r, COMPARISON_LAYOUT));
  const fixture = TestBed.createComponent(FindingsPlots);
  fixture.componentRef.setInput('result', result);
  fixture.componentRef.setInput('units', unitsOf(glucoseStudy(), result));
  fixture.componentRef.setInput('points', drawn ? plotPoints(rows, result.differenceType) : null);
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const words = (selector: string) => el.querySelector(selector)?.textContent?.replace(/\s+/g, ' ').trim() ?? null;
  const figures = () => Array.from(el.querySelectorAll('figure')).map((f) => f.getAttribute('data-testid'));
  return { el, words, figures };
}

describe('FindingsPlots', () => {
  // jsdom has no canvas: chart.js gets no context and draws nothing; the figures' words are HTML and are read here.
  beforeEach(() => jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null));
  afterEach(() => jest.restoreAllMocks());

  it('draws the four figures of the engine’s findings, the difference plot naming the goal and the decision levels', async () => {
    const { results } = glucoseFindings();
    const { words, figures } = await render(results as ComparisonFindingsResult);
    expect(figures()).toEqual(['plot-scatter', 'plot-difference', 'plot-null', 'plot-bias']);
    expect(words('[data-testid="plot-difference"] figcaption')).toContain(
      'Solid: the mean bias; dashed: the limits of agreement; the shaded bands are their confidence intervals. ' +
        'Dotted edges: the allowable bias as stated in Setup. Triangles on the x axis: the decision levels.',
    );
    const legend = words('[data-testid="plot-difference"] [data-testid="plot-legend"]')!;
    expect(legend).toContain(`Mean bias ${results.bias.mean.estimate!.toFixed(2)} mmol/L`);
    expect(legend).toContain('Allowable bias ±0.40 mmol/L');
    expect(legend).toContain('Decision levels 4.0, 10.0, 20.0 mmol/L');
    expect(words('[data-testid="plot-scatter"] [data-testid="plot-legend"]')).toContain('Identity y = x');
    expect(words('[data-testid="plot-null"] figcaption')).toMatch(/% of resamples; p [=<] ?0\.\d+\.$/);
  });

  it('draws no pairs from rows that changed since the analysis, and says so', async () => {
    const { results } = glucoseFindings();
    const { words, figures } = await render(results as ComparisonFindingsResult, false);
    expect(words('[data-testid="plots-stale"]')).toBe('The rows changed after this analysis, so the pairs are not drawn; run the analysis again to plot them.');
    expect(figures()).toEqual(['plot-null', 'plot-bias']);
  });

  it('says no allowable bias is drawn when Setup states none', async () => {
    const settings = StudySettings.parse({ ...GLUCOSE_SETTINGS, allowableBiasAbsolute: null });
    const result = engineComparison(glucoseFindings().rows, settings) as ComparisonFindingsResult;
    const { words } = await render(result);
    expect(words('[data-testid="plot-difference"] figcaption')).toContain('No allowable bias is stated, so none is drawn.');
    expect(words('[data-testid="plot-difference"] [data-testid="plot-legend"]')).not.toContain('Allowable bias');
  });
});
