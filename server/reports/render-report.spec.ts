import { kindMeta } from '@shared/kinds/kinds';
import { CAUTION as SHARED_CAUTION } from '@shared/text/caution';
import { renderStudyReport } from './render-report';
import type { ComparisonFindings } from './report-model';
import { comparisonReport, establishReport, verifyReport } from './testing/fixtures';
import { bodyLines, pdfLayout } from './testing/pdf-layout';
import { flat, pdfPages } from './testing/pdf-text';

// Written out here, not imported, so that a change of the printed wording fails a test.
const CAUTION =
  "Decision support only. These findings do not by themselves make a verification compliant: final acceptance follows local accreditation rules and the laboratory director's professional judgement. They hold only for the specimen types, measuring range, population and lots studied.";
const VERDICT_WORD = { within: 'Within', inconclusive: 'Inconclusive', exceeds: 'Exceeds' };

describe('the verification PDF of a method comparison', () => {
  const report = comparisonReport(40);
  const results = report.results as ComparisonFindings;
  const tenLevels = comparisonReport(40, { decisionLevels: [2, 3, 4, 5, 6, 8, 10, 12, 15, 20], allowableBiasPercent: 3 });
  let pages: string[][];

  beforeAll(async () => {
    pages = pdfPages(await renderStudyReport(report));
  });

  it('is built from a real analysis that gives all three verdicts', () => {
    expect(results.kind).toBe(kindMeta(report.study.kind).resultKind);
    expect(results.n).toBe(39);
    expect(results.decisionLevels.map((l) => l.verdict)).toEqual(['within', 'inconclusive', 'exceeds']);
  });

  it('draws each decision level on page 1 with its verdict word beside it and the numbers under the word', () => {
    const lines = pages[0];
    for (const level of results.decisionLevels) {
      const row = lines.findIndex((l) => l.startsWith(`${level.level.toFixed(1)} mmol/L `));
      expect(lines[row]).toBe(`${level.level.toFixed(1)} mmol/L ${VERDICT_WORD[level.verdict!]}`);
      expect(lines[row + 1]).toBe(`${level.bias.estimate!.toFixed(2)} mmol/L, 95% CI ${level.bias.ci![0].toFixed(2)} to ${level.bias.ci![1].toFixed(2)}`);
      expect(lines.slice(row + 1, row + 4)).toContain('allowable ±0.30 mmol/L');
    }
    expect(flat(lines)).toContain('Allowable bias ±0.30 mmol/L (source: Laboratory policy QP-12: 2024 proficiency-testing limit used as allowable bias)');
    expect(flat(lines)).not.toMatch(/[✓✔✗✘]/);
  });

  it('leads page 1 with the conclusion, then the picture, the pairs, who signed and then the plan; the settings come after', () => {
    const page1 = flat(pages[0]);
    const order = [
      'CONCLUSION Within the allowable bias at 3.0 mmol/L; inconclusive at 10.0 mmol/L; exceeds it at 20.0 mmol/L. Judged on the 95% CI',
      'Predicted bias at each medical decision level, against the allowable bias',
      '3.0 mmol/L Within',
      'Pairs 39 analysed of 40 entered; 1 excluded with its reason (row 7)',
      'Sign-off Signed by Dr. Imani Okafor Meaning Accepted for patient testing Date and time 2026-12-02 09:14 America/Halifax (UTC−04:00)',
    ];
    const at = order.map((phrase) => page1.indexOf(phrase));
    expect(at.every((i) => i >= 0)).toBe(true);
    expect([...at].sort((a, b) => a - b)).toEqual(at);
    // The plan follows the sign-off; what was studied and the settings come after the plan, not on page 1.
    const text = flat(pages);
    expect(text.indexOf('Plan and acceptance criteria')).toBeGreaterThan(text.indexOf('Verification code PX-7K3M-Q9TD'));
    for (const later of ['Analysis settings', 'Role Instrument Make and model', 'Kind of study Method comparison']) {
      expect(page1).not.toContain(later);
      expect(text.indexOf(later)).toBeGreaterThan(text.indexOf('Plan and acceptance criteria'));
    }
  });

  it('never ends a page with a heading and leaves no page but the last mostly empty', async () => {
    for (const sample of [report, comparisonReport(120), { ...report, draft: true, signature: null }, tenLevels]) {
      const laid = pdfLayout(await renderStudyReport(sample));
      laid.forEach((page, k) => {
        const body = bodyLines(page);
        const last = body[body.length - 1];
        // Headings are 12.5 pt and subheadings 10 pt; no other text is set in those sizes.
        expect({ page: k + 1, last: last.text, heading: [12.5, 10].includes(last.size) }).toEqual({ page: k + 1, last: last.text, heading: false });
        if (k < laid.length - 1) expect((last.top + last.size) / page.height).toBeGreaterThan(0.5);
      });
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

  it('carries a tall picture over to page 2 between its tracks, the axis under each part and the legend once', async () => {
    const laid = pdfPages(await renderStudyReport(tenLevels));
    const levels = (tenLevels.results as ComparisonFindings).decisionLevels;
    expect(levels).toHaveLength(10);
    const page1 = flat(laid[0]);
    expect(page1).toContain('CONCLUSION');
    expect(page1).toContain('Predicted bias at each medical decision level, against the allowable bias');
    const onPage1 = levels.filter((l) => page1.includes(`${l.level.toFixed(1)} mmol/L ${VERDICT_WORD[l.verdict!]}`));
    const onPage2 = levels.filter((l) => flat(laid[1]).includes(`${l.level.toFixed(1)} mmol/L ${VERDICT_WORD[l.verdict!]}`));
    expect(onPage1.length).toBeGreaterThanOrEqual(2);
    expect(onPage2.length).toBeGreaterThanOrEqual(2);
    expect(onPage1.length + onPage2.length).toBe(10);
    expect(onPage1.map((l) => l.level)).toEqual(levels.slice(0, onPage1.length).map((l) => l.level));
    for (const k of [0, 1]) expect(flat(laid[k])).toContain('Predicted bias at the level, candidate − comparative (mmol/L)');
    expect(flat(laid).split('Allowable bias ±0.30 mmol/L or ±3% of the level, whichever is greater (source:').length - 1).toBe(1);
    expect(flat(laid[1]).indexOf('Allowable bias ±0.30 mmol/L or ±3% of the level')).toBeGreaterThan(flat(laid[1]).indexOf('20.0 mmol/L'));
  });

  it('prints the caution in full beside the verdicts on page 1 and again on the last page', () => {
    // The one caution of screen, PDF and mail (shared/text/caution.ts), and it reads as written out above.
    expect(SHARED_CAUTION).toBe(CAUTION);
    expect(flat(pages[0])).toContain(CAUTION);
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
    expect(text).toContain(`(slope ${results.regression.slope.estimate!.toFixed(3)}, 95% CI`);
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

describe('page 1 of the reference-interval reports', () => {
  it.each([
    ['interval-establish', establishReport(130), /^CONCLUSION The reference interval is 1\d\d\.\d to 1\d\d\.\d mmol\/L: the 2\.5th and 97\.5th percentiles of \d+ values \(nonparametric\)\. The Harris & Boyd test/],
    ['interval-verify', verifyReport(20), /^CONCLUSION Not accepted: \d+ of \d+ values outside the stated interval \(at most \d+ allowed\)\. Advice: test 20 more/],
  ] as const)('%s leads with its conclusion, then the counts, the caution, the sign-off and the plan', async (_kind, sample, conclusion) => {
    const pages = pdfPages(await renderStudyReport(sample));
    const page1 = flat(pages[0]);
    const body = page1.slice(page1.indexOf('CONCLUSION'));
    expect(body).toMatch(conclusion);
    const firstTwo = flat(pages.slice(0, 2));
    const at = [/Values \d+ (analysed|tested) of \d+ entered/, /Caution Decision support only/, /Sign-off Signed by Dr\. Imani Okafor/, /Plan and acceptance criteria/]
      .map((phrase) => firstTwo.search(phrase));
    expect(at.every((i) => i >= 0)).toBe(true);
    expect([...at].sort((a, b) => a - b)).toEqual(at);
    expect(page1).not.toContain('Kind of study');
  });

  it.each([
    ['interval-establish', establishReport(130)],
    ['interval-verify', verifyReport(20)],
  ] as const)('%s never ends a page with a heading', async (_kind, sample) => {
    const laid = pdfLayout(await renderStudyReport(sample));
    laid.forEach((page, k) => {
      const body = bodyLines(page);
      expect({ page: k + 1, heading: [12.5, 10].includes(body[body.length - 1].size) }).toEqual({ page: k + 1, heading: false });
      if (k < laid.length - 1) expect((body[body.length - 1].top + body[body.length - 1].size) / page.height).toBeGreaterThan(0.5);
    });
  });
});
