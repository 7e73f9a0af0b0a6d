import { TestBed } from '@angular/core/testing';
import { LEVEL_VERDICT_WORDS } from '@shared/text/verdict-words';
import { fineGrained, SODIUM_UNITS, sodiumComparison, storedBeforeResolution } from '../../../../../../testing/coarse-results';
import type { ComparisonFindingsResult, Units } from '../comparison-result';
import { VerdictPanel } from './verdict-panel';

async function render(result: ComparisonFindingsResult, units: Units = SODIUM_UNITS, source = '') {
  const fixture = TestBed.createComponent(VerdictPanel);
  fixture.componentRef.setInput('result', result);
  fixture.componentRef.setInput('units', units);
  fixture.componentRef.setInput('source', source);
  await fixture.whenStable();
  const root = fixture.nativeElement as HTMLElement;
  const text = (id: string, within: ParentNode = root): string | null =>
    within.querySelector(`[data-testid="${id}"]`)?.textContent?.replace(/\s+/g, ' ').trim() ?? null;
  const rows = (): HTMLElement[] => [...root.querySelectorAll<HTMLElement>('[data-testid^="track-decisionLevels."]')];
  return { root, text, rows };
}

/** Glucose in steps of 0.1 mmol/L against ±0.30 mmol/L: within at 3, inconclusive at 10, exceeds at 20 (judged on the floor). */
function glucose(): ComparisonFindingsResult {
  const result = fineGrained(sodiumComparison());
  const level = (at: number, estimate: number, ci: [number, number], verdict: 'within' | 'inconclusive' | 'exceeds', judgedOn: [number, number] | null = null) => ({
    level: at, bias: { estimate, ci }, biasPercent: (100 * estimate) / at, allowable: 0.3, verdict, judgedOn,
  });
  result.decisionLevels = [
    level(3, 0.05, [0.01, 0.17], 'within'), level(10, 0.3, [0.2, 0.4], 'inconclusive'), level(20, 0.66, [0.61, 0.69], 'exceeds', [0.61, 0.71]),
  ];
  result.n = 39;
  result.settings = { ...result.settings, allowableBias: 0.3, allowableBiasPercent: null };
  result.resolution = { increment: 0.1, source: 'analyte', differenceIncrement: 0.1, slopeIncrement: null, limitedEstimates: ['decisionLevels.2'] };
  return result;
}
const GLUCOSE_UNITS: Units = { unit: 'mmol/L', difference: 'mmol/L', decimals: 2, differenceDecimals: 2, percent: false };

/** The percentage along the track an SVG attribute holds ("58.333%" → 58.333). */
const percentOf = (el: Element | null, name: string): number => Number(el?.getAttribute(name)?.replace('%', ''));

describe('VerdictPanel: the decision-level picture', () => {
  it('draws one track per level with its verdict word beside it, and a mark whose shape says the same', async () => {
    const { rows, text } = await render(glucose(), GLUCOSE_UNITS, 'Laboratory policy QP-12');
    expect(rows().map((r) => r.getAttribute('data-verdict'))).toEqual(['within', 'inconclusive', 'exceeds']);
    expect(rows().map((r) => text('verdict', r))).toEqual(['Within', 'Inconclusive', 'Exceeds']);
    expect(rows().map((r) => text('track-level', r))).toEqual(['3.0 mmol/L', '10.0 mmol/L', '20.0 mmol/L']);
    const marks = rows().map((r) => r.querySelector('[data-testid="track-mark"]')!);
    expect(marks.map((m) => m.getAttribute('data-mark'))).toEqual(['filled', 'half', 'open']);
    // Filled: the diamond is ink; half: a white diamond with its left half in ink; open: white with an ink outline.
    expect(marks[0].querySelector('path')!.getAttribute('fill')).toBe('var(--track-ink)');
    expect(marks[1].querySelectorAll('path.half')).toHaveLength(1);
    expect(marks[2].querySelector('path')!.getAttribute('fill')).toBe('#ffffff');
    expect(marks[2].querySelectorAll('path.half')).toHaveLength(0);
  });

  it("keys the three marks in the legend with the verdicts' words the PDF's legend uses (shared/text/verdict-words.ts)", async () => {
    const { root } = await render(glucose(), GLUCOSE_UNITS);
    const keys = [...root.querySelectorAll('figcaption.legend .key')].map((k) => k.textContent!.trim());
    expect(keys.slice(0, 3)).toEqual(['within', 'inconclusive', 'exceeds']);
    expect(keys.slice(0, 3)).toEqual((['within', 'inconclusive', 'exceeds'] as const).map((v) => LEVEL_VERDICT_WORDS[v].legend));
  });

  it('places the band, the CI and the estimate on one axis symmetric about zero', async () => {
    const { rows, root } = await render(glucose(), GLUCOSE_UNITS);
    // Axis −1.00 to 1.00: ±0.30 is the band from 35% to 65% of the track.
    for (const row of rows()) {
      const band = row.querySelector('[data-testid="track-band"]');
      expect(percentOf(band, 'x')).toBeCloseTo(35, 2);
      expect(percentOf(band, 'width')).toBeCloseTo(30, 2);
    }
    const [low, middle, high] = rows();
    expect(percentOf(low.querySelector('[data-testid="track-ci"]'), 'x1')).toBeCloseTo(50.5, 2);
    expect(percentOf(low.querySelector('[data-testid="track-ci"]'), 'x2')).toBeCloseTo(58.5, 2);
    expect(percentOf(low.querySelector('[data-testid="track-mark"]'), 'x')).toBeCloseTo(52.5, 2);
    // The inconclusive CI crosses the band's right edge at 65%; the exceeding one lies wholly beyond it.
    expect(percentOf(middle.querySelector('[data-testid="track-ci"]'), 'x1')).toBeLessThan(65);
    expect(percentOf(middle.querySelector('[data-testid="track-ci"]'), 'x2')).toBeGreaterThan(65);
    expect(percentOf(high.querySelector('[data-testid="track-ci"]'), 'x1')).toBeGreaterThan(65);
    expect([...root.querySelectorAll('.axis text')].map((t) => t.textContent)).toEqual(['−1.00', '−0.50', '0.00', '0.50', '1.00', expect.stringContaining('(mmol/L)')]);
  });

  it('shows the floor a verdict was judged on where the CI is narrower than the step, and only there', async () => {
    const { rows, text } = await render(glucose(), GLUCOSE_UNITS);
    const [low, , high] = rows();
    expect(low.querySelector('[data-testid="track-floor"]')).toBeNull();
    const floor = high.querySelector('[data-testid="track-floor"]');
    expect(percentOf(floor, 'x')).toBeCloseTo(80.5, 2);
    expect(percentOf(floor, 'width')).toBeCloseTo(5, 2);
    expect(high.textContent).toContain('judged on 0.61 to 0.71 mmol/L');
    expect(text('floor-key')).toBe('judged on: CI widened to ± half a reporting step');
  });

  it('labels each track for a screen reader and writes the words as text, with the band and its source', async () => {
    const { rows, text } = await render(glucose(), GLUCOSE_UNITS, 'Laboratory policy QP-12');
    const image = rows()[1].querySelector('svg[role="img"]')!;
    expect(image.getAttribute('aria-label')).toBe(
      'At 10.0 mmol/L: predicted bias 0.30 mmol/L, 95% CI 0.20 to 0.40; allowable ±0.30 mmol/L. Inconclusive: the CI crosses an edge of the allowable band.',
    );
    expect(text('band-caption')).toBe('Allowable bias ±0.30 mmol/L (source: Laboratory policy QP-12)');
    expect(text('verdict-overall')).toBe(
      'Within the allowable bias at 3.0 mmol/L; inconclusive at 10.0 mmol/L; exceeds it at 20.0 mmol/L. ' +
        'Judged on the 95% CI of the bias that the Passing–Bablok regression of 39 pairs predicts at each level; ' +
        'at 20.0 mmol/L that CI is narrower than one reporting step, so the verdict is judged on the estimate ± half a step.',
    );
    expect(text('sentence-decisionLevels.0')).toBe(
      'Within. At 3.0 mmol/L the predicted bias is 0.05 mmol/L (95% CI 0.01 to 0.17): the whole CI lies within the allowable ±0.30 mmol/L.',
    );
  });

  it('uses no traffic-light colours and no tick, question or cross glyphs', async () => {
    const { root } = await render(glucose(), GLUCOSE_UNITS);
    // The one icon is the reporting step's ruler beside its rule; none stands for a verdict.
    expect([...root.querySelectorAll('mat-icon')].map((i) => i.textContent)).toEqual(['straighten']);
    expect(root.textContent).not.toMatch(/[✓✔✗✘?]/);
    expect(root.innerHTML).not.toMatch(/check_circle|cancel|#93000a|#ffdad6|#ffeedb/);
  });
});

describe('VerdictPanel with results reported in whole steps', () => {
  it('states the rule of the reporting step once, at the top of the verdict', async () => {
    const { root } = await render(sodiumComparison());
    expect(root.querySelector('[data-testid="resolution-rule"] span')!.textContent).toBe(
      "Results are reported in steps of 1 mmol/L (from the analyte's decimals). A confidence interval narrower than one step says nothing finer than the step; " +
        'a decision-level verdict is judged on an interval no narrower than the estimate ± half a step (0.5 mmol/L). ' +
        'On the slope one step is 0.03 (a change that moves the line by one step across the comparative range).',
    );
    expect(root.querySelectorAll('[data-testid="resolution-rule"]')).toHaveLength(1);
    const figure = root.querySelector('[data-testid="decision-track"]')!;
    expect(root.querySelector('[data-testid="resolution-rule"]')!.compareDocumentPosition(figure) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
  });

  it('draws at each level the floor the verdict was judged on and says why in its sentence', async () => {
    const { rows, text } = await render(sodiumComparison());
    expect(rows()).toHaveLength(2);
    for (const [k, row] of rows().entries()) {
      // Axis −3.0 to 3.0: the band ±2.0 runs from 16.7% to 83.3%, the floor 0.5 to 1.5 from 58.3% to 75%.
      expect(percentOf(row.querySelector('[data-testid="track-band"]'), 'x')).toBeCloseTo(100 / 6, 2);
      expect(percentOf(row.querySelector('[data-testid="track-floor"]'), 'x')).toBeCloseTo(350 / 6, 2);
      expect(percentOf(row.querySelector('[data-testid="track-floor"]'), 'width')).toBeCloseTo(100 / 6, 2);
      expect(row.textContent).toContain('judged on 0.5 to 1.5 mmol/L');
      expect(text(`sentence-decisionLevels.${k}`)).toContain(
        'The CI is narrower than one reporting step (1 mmol/L), so the verdict is judged on 0.5 to 1.5 mmol/L',
      );
    }
    expect(text('median-bias')).toContain('The CI is narrower than one reporting step (1 mmol/L): the data cannot show a difference finer than the step.');
  });

  it.each([
    ['fine-grained data', fineGrained(sodiumComparison())],
    ['results stored by engine 1.1.0', storedBeforeResolution(sodiumComparison())],
  ])('shows no word of the step and no floor for %s', async (_name, result) => {
    const { root, text } = await render(result);
    expect(text('resolution-rule')).toBeNull();
    expect(root.querySelectorAll('[data-testid="track-floor"]')).toHaveLength(0);
    expect(text('floor-key')).toBeNull();
    expect(root.textContent).not.toContain('step');
    expect(text('verdict-sentences')).toContain('(95% CI 1.0 to 1.0): the whole CI lies within the allowable ±2.0 mmol/L.');
  });
});
