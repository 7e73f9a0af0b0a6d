import { renderStudyReport } from './render-report';
import type { ComparisonFindings } from './report-model';
import { comparisonReport } from './testing/fixtures';
import { flat, pdfPages } from './testing/pdf-text';

// Written out here, not imported, so that a change of the printed wording fails a test.
const CAUTION =
  "Decision support only. These findings do not by themselves make a verification compliant: final acceptance follows local accreditation rules and the laboratory director's professional judgement. They hold only for the specimen types, measuring range, population and lots studied.";
const VERDICT_START = { within: 'Within the allowable bias', inconclusive: 'Inconclusive: the CI crosses', exceeds: 'Exceeds the allowable bias' };

describe('the verification PDF of a method comparison', () => {
  const report = comparisonReport(40);
  const results = report.results as ComparisonFindings;
  let pages: string[][];

  beforeAll(async () => {
    pages = pdfPages(await renderStudyReport(report));
  });

  it('is built from a real analysis that gives all three verdicts', () => {
    expect(results.kind).toBe('comparison');
    expect(results.n).toBe(39);
    expect(results.decisionLevels.map((l) => l.verdict)).toEqual(['within', 'inconclusive', 'exceeds']);
  });

  it('states the verdict in words on the row of each decision level', () => {
    const lines = pages.flat();
    for (const level of results.decisionLevels) {
      const row = lines.find((l) => l.startsWith(`${level.level.toFixed(1)} mmol/L `) && /Within|Inconclusive|Exceeds/.test(l));
      expect(row).toContain(VERDICT_START[level.verdict!]);
      expect(row).toContain(`${level.bias.ci![0].toFixed(2)} to ${level.bias.ci![1].toFixed(2)}`);
    }
  });

  it('puts the content hash, the verification code and "Page x of N" in the footer of every page', () => {
    expect(pages.length).toBeGreaterThan(3);
    pages.forEach((lines, k) => {
      const text = flat(lines);
      expect(text).toContain(`Content hash SHA-256 ${report.contentHash}`);
      expect(text).toContain('Verification code PX-7K3M-Q9TD');
      expect(text).toContain(`Page ${k + 1} of ${pages.length}`);
      expect(text).not.toContain('DRAFT');
    });
  });

  it('prints the caution in full beside the verdicts and again on the last page', () => {
    const findingsPage = pages.findIndex((lines) => lines.includes('Findings at the decision levels'));
    expect(findingsPage).toBeGreaterThanOrEqual(0);
    expect(flat(pages[findingsPage])).toContain(CAUTION);
    expect(flat(pages[pages.length - 1])).toContain(CAUTION);
    expect(flat(pages).split(CAUTION).length - 1).toBe(2);
  });

  it("prints the signer's name, the meaning in words and the time in the laboratory's zone", () => {
    const text = flat(pages);
    expect(text).toContain('Signed by Dr. Imani Okafor');
    expect(text).toContain('Meaning Accepted for patient testing');
    expect(text).toContain('Date and time 2026-12-02 09:14 America/Halifax (UTC−04:00)');
  });

  it('prints the settings, the statistics, the exclusion with its reason and every specimen', () => {
    const text = flat(pages);
    expect(text).toContain('Seed report-test');
    expect(text).toContain('Bootstrap resamples 2,000 for the bias; 1,000 for the regression');
    expect(text).toContain(`Mean bias ${results.bias.mean.estimate!.toFixed(2)}`);
    expect(text).toContain(`Slope b ${results.regression.slope.estimate!.toFixed(4)}`);
    expect(text).toContain('Sensitivity: with and without the excluded rows');
    expect(text).toContain('Haemolysed specimen (H-index 3+)');
    expect(text).toContain('Criteria changed after approval');
    for (const row of report.rows) expect(text).toContain(row.label);
  });

  it('renders µ, ±, σ, ≤, ≥, −, λ, ² and → as text', () => {
    const text = flat(pages);
    // pdfjs reads the micro sign U+00B5 as Greek mu U+03BC (Unicode compatibility mapping).
    expect(text).toMatch(/[µμ], ±, σ, ≤, ≥, −, λ, ² → all printable/);
    expect(text).toContain('8.1 → 8.4 mmol/L');
  });

  it('prints the Deming error ratio with its convention, and percent differences in %', async () => {
    const deming = comparisonReport(40, { regression: 'deming', demingRatio: 1.5, differenceType: 'percent-mean' });
    const text = flat(pdfPages(await renderStudyReport(deming)));
    expect(text).toContain('Regression Deming');
    expect(text).toContain('Deming error ratio λ = 1.500, where λ = σ²(x error) / σ²(y error)');
    expect(text).toContain('Bias and agreement (differences in %)');
    expect(text).toContain('Difference y − x (%)');
  });
});
