import { TestBed } from '@angular/core/testing';
import {
  bestFitSentence, claimText, designRows, fitRows, levelHeadings, levelRows, rangeFormat as formatOf, rangeText, verdictSentence,
} from '@shared/kinds/reportable-range/words';
import type { Analysis, Study } from '@shared/schemas';
import { StudySettings } from '@shared/schemas';
import { CAUTION } from '@shared/stats/comparison-types';
import { noAnimations } from '../../../../../../testing/http';
import { RangeFindings } from './range-findings';
import { asRange, rangeFormat } from './range-result';
import { fractionRange, shortenedRange, straightRange } from './range-results.testing';

const STUDY = {
  id: 41, kind: 'reportable-range', title: 'Glucose: reportable range of the new analyser', analyte: { id: 2, name: 'Glucose' }, analyteUnit: 'mmol/L',
  settings: { ...StudySettings.parse({ unit: 'mmol/L', decimals: 1 }), nonlinearitySource: 'Half the allowable bias (lab policy)' },
  version: 2, state: 'draft', findings: 'current',
} as unknown as Study;
const F = formatOf('mmol/L', 1);

function analysis(results: unknown): Analysis {
  return { id: 77, studyId: 41, state: 'done', current: true, results } as Analysis;
}

async function render(inputs: { analysis: Analysis; results?: unknown }) {
  TestBed.configureTestingModule({ providers: [noAnimations] });
  const fixture = TestBed.createComponent(RangeFindings);
  fixture.componentRef.setInput('study', STUDY);
  fixture.componentRef.setInput('analysis', inputs.analysis);
  if ('results' in inputs) fixture.componentRef.setInput('results', inputs.results);
  await fixture.whenStable();
  const root = fixture.nativeElement as HTMLElement;
  const text = (id: string): string | null => root.querySelector(`[data-testid="${id}"]`)?.textContent?.replace(/\s+/g, ' ').trim() ?? null;
  /** A line's words, without its icon's ligature. */
  const words = (id: string): string | null => root.querySelector(`[data-testid="${id}"] span`)?.textContent?.trim() ?? null;
  /** The cells' words, without an icon's ligature. */
  const cellText = (c: Element): string => {
    const copy = c.cloneNode(true) as Element;
    copy.querySelectorAll('mat-icon').forEach((icon) => icon.remove());
    return copy.textContent!.replace(/\s+/g, ' ').trim();
  };
  const cells = (selector: string, part = 'tbody'): string[][] =>
    Array.from(root.querySelectorAll(`${selector} ${part} tr`)).map((tr) => Array.from(tr.children).map(cellText));
  return { root, text, cells, words };
}

describe('range results on the Findings panel', () => {
  it('takes the unit and the decimals from the study (the analyte’s unit when the study sets none)', () => {
    expect(rangeFormat({ settings: { decimals: 1, unit: 'mmol/L' }, analyteUnit: 'g/L' } as never)).toEqual({ unit: 'mmol/L', value: 1, stat: 2, percent: 1 });
    expect(rangeFormat({ settings: { decimals: 0, unit: '' }, analyteUnit: 'U/L' } as never).unit).toBe('U/L');
  });

  it('reads reportable-range results and refuses results of another kind', () => {
    const r = straightRange();
    expect(asRange(r)).toBe(r);
    expect(asRange({ kind: 'precision', levels: [], fits: [] })).toBeNull();
    expect(asRange({ kind: 'reportable-range', levels: [] })).toBeNull();
    expect(asRange(null)).toBeNull();
  });
});

describe('RangeFindings', () => {
  // jsdom has no canvas: chart.js gets no context and draws nothing, which is all these tests need.
  beforeEach(() => jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null));
  afterEach(() => jest.restoreAllMocks());

  it('puts the verdict first, with the verified range, the claim and the best fit in the study’s words', async () => {
    const r = shortenedRange();
    const { root, text, cells } = await render({ analysis: analysis(r), results: r });
    expect(Array.from(root.querySelectorAll('section')).map((s) => s.getAttribute('data-testid'))).toEqual([
      'range-conclusion', 'range-linearity', 'range-levels', 'range-fits', 'range-design',
    ]);
    const verdict = root.querySelector('[data-testid="range-verdict"]')!;
    expect(verdict.querySelector('span')!.textContent).toBe('Reportable range shortened');
    expect(verdict.querySelector('mat-icon')!.textContent!.trim()).toBe('compress');
    expect([verdict.classList.contains('accepted'), verdict.classList.contains('refused')]).toEqual([false, false]);
    expect(text('range-sentence')).toBe(verdictSentence(r, F));
    expect(text('range-sentence')).toContain('"Level 6"');
    const source = { ...r, goal: { ...r.goal, source: 'Half the allowable bias (lab policy)' } };
    expect(cells('[data-testid="range-facts"]')).toEqual([
      ['Verified range', rangeText(source, F)], ['Claimed measuring interval', claimText(r.claimed, F)],
    ]);
    expect(rangeText(r, F)).toContain('Level 1');
  });

  it('marks a verified range as met and a range not verified as not, by words, icon and ink', async () => {
    const verified = straightRange();
    let { root } = await render({ analysis: analysis(verified) });
    let verdict = root.querySelector('[data-testid="range-verdict"]')!;
    expect(verdict.textContent).toContain('Reportable range verified');
    expect(verdict.classList).toContain('accepted');
    expect(verdict.querySelector('mat-icon')!.textContent!.trim()).toBe('done_all');

    TestBed.resetTestingModule();
    const none = { ...verified, verdict: 'range-not-verified' as const, verifiedRange: null, levels: verified.levels.map((l) => ({ ...l, within: false })) };
    ({ root } = await render({ analysis: analysis(none) }));
    verdict = root.querySelector('[data-testid="range-verdict"]')!;
    expect(verdict.textContent).toContain('Reportable range not verified');
    expect(verdict.classList).toContain('refused');
  });

  it('draws the results against the levels with both fits and the allowable band, named in the legend', async () => {
    const r = shortenedRange();
    const { root, text } = await render({ analysis: analysis(r) });
    expect(root.querySelector('[data-testid="plot-linearity"] canvas')!.getAttribute('aria-label')).toBe('Results against the levels');
    expect(Array.from(root.querySelectorAll('[data-testid="plot-linearity"] [data-testid="plot-legend"] li')).map((li) => li.textContent!.trim())).toEqual([
      'Results', "Level's mean", 'Straight line', 'Best fit: polynomial of degree 3',
      'Allowable nonlinearity around the straight line: 0.8 mmol/L or 3% of the level, whichever is larger (source: Half the allowable bias (lab policy))',
    ]);
    expect(text('plot-linearity')).toContain('12 results at 6 levels');
  });

  it('shows the deviation at each level against the goal: a track each, marked by shape and said in words', async () => {
    const r = shortenedRange();
    const { root } = await render({ analysis: analysis(r) });
    const tracks = Array.from(root.querySelectorAll('[data-testid="deviation-track"] .row:not(.axis-row)'));
    expect(tracks).toHaveLength(6);
    expect(tracks.map((t) => t.querySelector('[data-testid="track-mark"]')!.getAttribute('data-mark'))).toEqual(['filled', 'filled', 'filled', 'half', 'filled', 'open']);
    expect(tracks.map((t) => t.querySelector('[data-testid="judgement"]')!.textContent)).toEqual([
      'Within', 'Within', 'Within', 'Within (CI reaches beyond)', 'Within', 'Beyond the goal',
    ]);
    expect(tracks[5].querySelector('svg.track')!.getAttribute('aria-label')).toBe(
      'Level 6 (32.0 mmol/L): deviation −0.98 mmol/L (−3.2%), 95% CI −1.07 to −0.90 mmol/L, allowable ±0.92 mmol/L. Beyond the goal.',
    );
    expect(tracks.every((t) => t.querySelector('[data-testid="track-ci"]') && t.querySelector('[data-testid="track-band"]'))).toBe(true);
    expect(root.querySelector('[data-testid="band-caption"]')!.textContent!.trim()).toBe(
      'Allowable nonlinearity 0.8 mmol/L or 3% of the level, whichever is larger (source: Half the allowable bias (lab policy))',
    );
  });

  it('tables each level with the shared headings and cells, recovery included where values are assigned', async () => {
    const r = shortenedRange();
    const { cells } = await render({ analysis: analysis(r) });
    const h = levelHeadings(r, F);
    expect(cells('[data-testid="level-table"]', 'thead')).toEqual([[
      h.level, h.x, h.n, h.mean, h.sd, h.linear, h.fitted, h.deviation, h.deviationPercent, h.ci, h.goal, h.recovery, h.within,
    ]]);
    expect(cells('[data-testid="level-table"]')).toEqual(levelRows(r, F).map((row) => [
      row.level, row.x, row.n, row.mean, row.sd, row.linear, row.fitted, row.deviation, row.deviationPercent, row.ci, row.goal, row.recovery, row.within,
    ]));
    expect(cells('[data-testid="level-table"]')[5]).toEqual(['Level 6', '32.0', '2', '29.70', '0.14', '30.76', '29.77', '−0.98', '−3.2%', '−1.07 to −0.90', '±0.92', '92.8%', 'Beyond the goal']);
  });

  it('leaves recovery out when the levels are fractions without pool values, and says when a CI is finer than the reporting step', async () => {
    const r = fractionRange();
    const { cells, words } = await render({ analysis: analysis(r) });
    const heads = cells('[data-testid="level-table"]', 'thead')[0];
    expect(heads).not.toContain('Recovery %');
    expect(heads[1]).toBe('Fraction of the high pool');
    expect(cells('[data-testid="level-table"]')[0]).toHaveLength(12);
    expect(words('resolution-rule')).toMatch(/^Results are reported in steps of 0\.1 mmol\/L/);
  });

  it('tables the polynomial fits with the best one marked, then the warnings and the design', async () => {
    const r = shortenedRange();
    const { root, cells, text } = await render({ analysis: analysis(r) });
    expect(text('best-fit')).toBe(bestFitSentence(r));
    expect(cells('[data-testid="fit-table"]')).toEqual(fitRows(r, F).map((f) => [f.degree, f.coefficients, f.se, f.p, f.syx, f.judgement]));
    expect(root.querySelector('[data-testid="fit-3"]')!.classList).toContain('best');
    expect(root.querySelector('[data-testid="fit-3"] mat-icon')).not.toBeNull();
    expect(root.querySelector('[data-testid="fit-2"] mat-icon')).toBeNull();
    expect(Array.from(root.querySelectorAll('[data-testid="warnings"] li')).map((li) => li.textContent!.trim())).toEqual(r.warnings);
    expect(cells('[data-testid="design"]')).toEqual(designRows({ ...r, goal: { ...r.goal, source: STUDY.settings['nonlinearitySource' as never] } }, F));
    expect(text('resolution-rule')).toBeNull();
    expect(text('range-caution')).toBeNull();
  });

  it('shows a caution of the results’ own that says more than the common one, and says when there are no warnings', async () => {
    const r = { ...straightRange(), caution: `${CAUTION} The range holds for the reagent lot tested.` };
    const { text } = await render({ analysis: analysis(r) });
    expect(text('range-caution')).toBe(`${CAUTION} The range holds for the reagent lot tested.`);
    expect(text('no-warnings')).toBe('No warnings.');
    expect(text('warnings')).toBeNull();
  });

  it('keeps the goal’s source the served results carry, and takes the study’s otherwise', async () => {
    const r = { ...shortenedRange() };
    r.goal = { ...r.goal, source: 'Manufacturer' };
    const { root } = await render({ analysis: analysis(r) });
    expect(root.querySelector('[data-testid="band-caption"]')!.textContent).toContain('(source: Manufacturer)');
  });

  it('refuses results of another kind in words', async () => {
    const { root } = await render({ analysis: analysis({ kind: 'precision' }), results: { kind: 'precision' } });
    expect(root.textContent).toContain('not those of a reportable-range study');
    expect(root.querySelector('section')).toBeNull();
  });
});
