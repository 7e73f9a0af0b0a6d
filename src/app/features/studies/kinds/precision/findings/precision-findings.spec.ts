import { TestBed } from '@angular/core/testing';
import type { Analysis, Study } from '@shared/schemas';
import { StudySettings } from '@shared/schemas';
import { noAnimations } from '../../../../../../testing/http';
import { precisionResult } from '@shared/kinds/precision/words-fixture';
import { PrecisionFindings } from './precision-findings';

const STUDY = {
  id: 31, kind: 'precision', title: 'Glucose: precision of the new analyser', analyte: { id: 2, name: 'Glucose' }, analyteUnit: 'mmol/L',
  settings: StudySettings.parse({ unit: 'mmol/L', decimals: 2 }), version: 2, state: 'draft', findings: 'current',
} as unknown as Study;

function analysis(results: unknown): Analysis {
  return { id: 77, studyId: 31, state: 'done', current: true, results } as Analysis;
}

async function render(inputs: { analysis: Analysis; results?: unknown }) {
  TestBed.configureTestingModule({ providers: [noAnimations] });
  const fixture = TestBed.createComponent(PrecisionFindings);
  fixture.componentRef.setInput('study', STUDY);
  fixture.componentRef.setInput('analysis', inputs.analysis);
  if ('results' in inputs) fixture.componentRef.setInput('results', inputs.results);
  await fixture.whenStable();
  const root = fixture.nativeElement as HTMLElement;
  const text = (id: string): string | null => root.querySelector(`[data-testid="${id}"]`)?.textContent?.replace(/\s+/g, ' ').trim() ?? null;
  const cells = (selector: string): string[][] =>
    Array.from(root.querySelectorAll(`${selector} tbody tr`)).map((tr) => Array.from(tr.children).map((c) => c.textContent!.trim()));
  /** A verdict's words, without its icon's ligature. */
  const words = (id: string): string | null => root.querySelector(`[data-testid="${id}"] span`)?.textContent?.trim() ?? null;
  const icon = (id: string): string | null => root.querySelector(`[data-testid="${id}"] mat-icon`)?.textContent?.trim() ?? null;
  return { root, text, cells, words, icon };
}

describe('PrecisionFindings', () => {
  // jsdom has no canvas: chart.js gets no context and draws nothing, which is all these tests need.
  beforeEach(() => jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null));
  afterEach(() => jest.restoreAllMocks());

  it('puts the conclusion first, then each material with its verdicts in words', async () => {
    const r = precisionResult();
    const { root, text, words, icon } = await render({ analysis: analysis(r), results: r });
    const sections = Array.from(root.querySelectorAll('section')).map((s) => s.getAttribute('data-testid'));
    expect(sections).toEqual(['precision-conclusion', 'material-0', 'material-1', 'precision-design']);
    expect(text('precision-overall')).toBe(
      '4 claims over 2 materials: 1 verified, 2 consistent with the claim, 1 not verified. Trueness verified for 1 of 1 material with an assigned value.',
    );
    expect(root.querySelector('[data-testid="precision-overall"]')!.classList).toContain('refused');
    expect(text('material-summary-0')).toBe('9 results over 3 days; grand mean 5.443 mmol/L.');
    expect(words('verdict-repeatability-0')).toBe('Repeatability verified: SD 0.052 mmol/L is within the claim 0.060 mmol/L.');
    expect(icon('verdict-repeatability-0')).toBe('check_circle');
    expect(icon('verdict-withinLab-1')).toBe('task_alt');
    expect(icon('verdict-repeatability-1')).toBe('cancel');
    expect(words('verdict-withinLab-1')).toBe(
      'Within-laboratory precision consistent with the claim: CV 3.4% exceeds the claim 3.0% but not the upper verification limit 3.6% (α = 0.05, 2 materials).',
    );
    const notVerified = root.querySelector('[data-testid="verdict-repeatability-1"]')!;
    expect(words('verdict-repeatability-1')).toBe('Repeatability not verified: CV 2.43% exceeds the upper verification limit 2.41% of the claim 2.00% (α = 0.05, 2 materials).');
    expect(notVerified.classList).toContain('refused');
    expect(words('verdict-trueness-1')).toBe(
      'Trueness verified: the mean 11.850 mmol/L lies within the verification interval 11.620 to 12.380 mmol/L around the assigned value 12.00 mmol/L (bias −0.150 mmol/L, −1.3%).',
    );
    expect(icon('verdict-trueness-1')).toBe('check_circle');
    expect(text('verdict-trueness-0')).toBeNull();
  });

  it('tables the three components with their CIs, claims, limits and verdicts', async () => {
    const { root, text, cells } = await render({ analysis: analysis(precisionResult()) });
    const heads = Array.from(root.querySelectorAll('[data-testid="components-0"] thead th')).map((th) => th.textContent!.trim());
    expect(heads).toEqual(['Component', 'SD (mmol/L)', 'CV (%)', 'df', '95% CI of the SD (mmol/L)', 'Claim (SD, mmol/L)', 'Upper verification limit (SD, mmol/L)', 'Verdict']);
    expect(cells('[data-testid="components-0"]')).toEqual([
      ['Repeatability', '0.052', '1.0', '6', '0.034 to 0.115', '0.060', '0.090', 'Verified'],
      ['Between-day', '0.050', '0.9', '—', '—', '—', '—', 'No claim'],
      ['Within-laboratory precision', '0.087', '1.6', '3.3', '0.050 to 0.287', '0.080', '0.111', 'Consistent with the claim'],
    ]);
    expect(cells('[data-testid="components-1"]')[0]).toEqual(['Repeatability', '0.288', '2.43', '6', '0.186 to 0.634', '2.00', '2.41', 'Not verified']);
    expect(text('terms-1')).toBe(
      'The claims are CVs in %, so each estimate is judged as a CV. Verified: within the claim. Consistent with the claim: above the claim but ' +
      'within its upper verification limit (UVL), the most a laboratory whose true precision equals the claim would see by chance. ' +
      'Not verified: above that limit. Between-day precision has no claim of its own: it is part of the within-laboratory precision.',
    );
  });

  it('shows the trueness details, the notes and the flagged replicates of a material', async () => {
    const { root, text, cells } = await render({ analysis: analysis(precisionResult()) });
    expect(cells('[data-testid="trueness-1"]')).toContainEqual(['Bias (mean − assigned value)', '−0.150 mmol/L (−1.3%)']);
    expect(text('notes-1')).toBe('Unbalanced design: the days have 2 to 4 results.');
    expect(text('notes-0')).toBeNull();
    expect(cells('[data-testid="flagged-1"]')).toEqual([['2', '1', '12.20', '14', 'More than 5.5 repeatability SDs from the day mean']]);
    expect(Array.from(root.querySelectorAll('[data-testid="flagged-1"] thead th')).map((th) => th.textContent!.trim())).toEqual(['Day', 'Replicate', 'Result (mmol/L)', 'Row', 'Why']);
    expect(text('flagged-0')).toBeNull();
  });

  it('draws each material’s days with the plot said in words as its accessible label', async () => {
    const { root, text } = await render({ analysis: analysis(precisionResult()) });
    const canvas = root.querySelector('[data-testid="plot-days-0"] canvas')!;
    expect(canvas.getAttribute('role')).toBe('img');
    expect(canvas.getAttribute('aria-label')).toMatch(/^Level 1: 9 results on 3 days around the grand mean 5\.443 mmol\/L\./);
    expect(text('plot-days-1')).toContain('Results by day: Level 2');
    expect(Array.from(root.querySelectorAll('[data-testid="plot-days-1"] [data-testid="plot-legend"] li')).map((li) => li.textContent!.trim())).toEqual([
      'Results', 'Flagged replicates', "Day's mean", 'Grand mean 11.850 mmol/L',
    ]);
  });

  it('ends with the warnings and the design, and leaves the common caution to the Findings tab', async () => {
    const { text, cells } = await render({ analysis: analysis(precisionResult()) });
    expect(text('warnings')).toBe('Fewer days than planned: 3 of 5.');
    expect(cells('[data-testid="design"]')).toContainEqual(['Engine version', '1.3.0']);
    expect(cells('[data-testid="design"]')).toContainEqual(['Excluded with a reason', '1']);
    expect(text('precision-caution')).toBeNull();
  });

  it('shows a caution of the results’ own that says more than the common one, and says when there are no warnings', async () => {
    const r = { ...precisionResult(), warnings: [], caution: 'Decision support only; precision holds for the control lots tested.' };
    const { text } = await render({ analysis: analysis(r) });
    expect(text('precision-caution')).toBe('Decision support only; precision holds for the control lots tested.');
    expect(text('no-warnings')).toBe('No warnings.');
    expect(text('warnings')).toBeNull();
  });

  it('reads the analysis’s own results when none are handed over, and marks an all-verified conclusion as met', async () => {
    const [one] = precisionResult().materials;
    const r = precisionResult([{ ...one, verdicts: { repeatability: 'verified', withinLab: 'verified' } }]);
    const { root, text } = await render({ analysis: analysis(r) });
    expect(text('precision-overall')).toBe('Every claim verified: repeatability and within-laboratory precision of 1 material.');
    expect(root.querySelector('[data-testid="precision-overall"]')!.classList).toContain('accepted');
  });

  it('refuses results of another kind in words', async () => {
    const { root } = await render({ analysis: analysis({ kind: 'interval' }), results: { kind: 'interval' } });
    expect(root.textContent).toContain('not those of a precision verification');
    expect(root.querySelector('section')).toBeNull();
  });
});
