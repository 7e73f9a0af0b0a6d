import { execFileSync } from 'node:child_process';
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { renderStudyReport } from './render-report';
import type { StudyReport } from './report-model';
import { comparisonReport, establishReport, sodiumComparisonReport, verifyReport } from './testing/fixtures';
import { flat, pdfPages } from './testing/pdf-text';

/**
 * Writes sample reports and PNGs of every page, in colour and in grey (poppler's pdftoppm, 60 dpi; page 1
 * also at 110 dpi), to .test-output/report/ (git-ignored), for people to look at: the grey ones show what a
 * black-and-white print keeps of the decision-level picture.
 */
const OUT = join(__dirname, '..', '..', '.test-output', 'report');
const signed = comparisonReport(40);
const samples: [string, StudyReport][] = [
  ['comparison-signed', signed],
  ['comparison-draft', { ...signed, draft: true, signature: null, study: { ...signed.study, state: 'draft' } }],
  ['comparison-120-rows', comparisonReport(120)],
  ['comparison-whole-steps', sodiumComparisonReport(60)],
  ['interval-establish', establishReport(130)],
  ['interval-verify', verifyReport(20)],
];

/** What page 1 of each sample must say, in this order. */
const PAGE_ONE: Record<string, string[]> = {
  'comparison-signed': ['CONCLUSION Within the allowable bias at 3.0 mmol/L', '3.0 mmol/L Within', '10.0 mmol/L Inconclusive', '20.0 mmol/L Exceeds', 'Pairs 39 analysed', 'Signed by Dr. Imani Okafor'],
  'comparison-draft': ['DRAFT — not signed', 'CONCLUSION Within the allowable bias at 3.0 mmol/L', '20.0 mmol/L Exceeds', 'Signature Not signed. This is a preview'],
  'comparison-120-rows': ['CONCLUSION', 'mmol/L Within', 'Pairs 119 analysed of 120 entered', 'Signed by'],
  'comparison-whole-steps': ['CONCLUSION The predicted bias is within the allowable bias at every decision level (130 and 150 mmol/L)', '130 mmol/L Within', 'judged on 0.5 to 1.5 mmol/L', 'judged on: CI widened to ± half a reporting step', 'Signed by'],
  'interval-establish': ['CONCLUSION The reference interval is', 'Values', 'Signed by'],
  'interval-verify': ['CONCLUSION Not accepted:', 'Values', 'Signed by'],
};

describe('sample reports for review', () => {
  beforeAll(() => mkdirSync(OUT, { recursive: true }));

  it.each(samples)('writes %s.pdf and PNGs of every page, in colour and in grey, with page 1 leading with its conclusion', async (name, report) => {
    for (const old of readdirSync(OUT).filter((f) => f.startsWith(`${name}-`) && f.endsWith('.png'))) rmSync(join(OUT, old));
    const bytes = await renderStudyReport(report);
    const pdf = join(OUT, `${name}.pdf`);
    writeFileSync(pdf, bytes);
    execFileSync('pdftoppm', ['-png', '-r', '60', pdf, join(OUT, name)]);
    execFileSync('pdftoppm', ['-png', '-gray', '-r', '60', pdf, join(OUT, `${name}-grey`)]);
    execFileSync('pdftoppm', ['-png', '-r', '110', '-f', '1', '-l', '1', pdf, join(OUT, `${name}-large`)]);
    const pages = pdfPages(bytes);
    const pngs = readdirSync(OUT).filter((f) => new RegExp(`^${name}-\\d+\\.png$`).test(f));
    const greys = readdirSync(OUT).filter((f) => new RegExp(`^${name}-grey-\\d+\\.png$`).test(f));
    expect(pngs).toHaveLength(pages.length);
    expect(greys).toHaveLength(pages.length);
    for (const file of [...pngs, ...greys]) expect(readFileSync(join(OUT, file)).subarray(1, 4).toString('latin1')).toBe('PNG');

    const page1 = flat(pages[0]);
    const at = PAGE_ONE[name].map((phrase) => page1.indexOf(phrase));
    expect(Object.fromEntries(PAGE_ONE[name].map((phrase, k) => [phrase, at[k] >= 0]))).toEqual(Object.fromEntries(PAGE_ONE[name].map((phrase) => [phrase, true])));
    expect([...at].sort((a, b) => a - b)).toEqual(at);
    // What was studied comes after the conclusion, the sign-off and the plan.
    expect(page1).not.toContain('Kind of study');
  });
});
