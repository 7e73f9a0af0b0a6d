import { kindMeta } from '@shared/kinds/kinds';
import { renderStudyReport } from './render-report';
import type { EstablishFindings, StudyReport, VerifyFindings } from './report-model';
import { valueBins } from '@shared/types/plot-axes';
import { referenceBins } from './sections/establish-report';
import { comparisonReport, establishReport, intervalRows, verifyReport } from './testing/fixtures';
import { flat, pdfPages } from './testing/pdf-text';

describe('the reports of reference-interval studies', () => {
  it('prints the established limits with both CIs, the method and why, the partition test and the histogram', async () => {
    const report = establishReport(130);
    const results = report.results as EstablishFindings;
    const text = flat(pdfPages(await renderStudyReport(report)));
    const lower = results.lower!;
    expect(text).toContain('Reference interval establishment: study report');
    expect(text).toContain(`Lower limit 2.5th ${lower.estimate!.toFixed(1)} ${lower.ci![0].toFixed(1)} to ${lower.ci![1].toFixed(1)} ${lower.rankCi![0].toFixed(1)} to ${lower.rankCi![1].toFixed(1)} ${lower.ranks!.lowerRank}–${lower.ranks!.upperRank}`);
    expect(text).toContain(`Values ${results.n} analysed; ${results.excludedCount} excluded of 130`);
    expect(text).toContain('Why this method Makes no assumption about the shape of the distribution');
    expect(text).toContain('Partition by sex (Harris & Boyd)');
    expect(text).toContain(`z = ${results.partitions[0].z!.toFixed(2)} against z* = ${results.partitions[0].zCritical!.toFixed(2)}`);
    expect(text).toContain(`Histogram of ${results.n} values`);
    // The histogram's legend names both limits with their values, in the tables' decimals.
    const unit = report.analyte.unit;
    expect(text).toContain(`limits ${lower.estimate!.toFixed(1)} ${unit} and ${results.upper!.estimate!.toFixed(1)} ${unit}`);
    expect(text).toContain(`${Math.round(100 * results.settings.level)}% CI of each limit`);
    expect(text).toContain('On diuretics (questionnaire)');
  });

  it('bins the reference values by the shared rule the findings page draws with (valueBins): exact edges, excluded rows left out', () => {
    const values = [138, 139, 139, 140, 140, 140, 141, 143, 150];
    const rows = intervalRows(values.length).map((r, k) => ({ ...r, value: values[k], excluded: k === 8, exclusionReason: k === 8 ? 'On diuretics' : null }));
    const report = establishReport(values.length, rows);
    const results = report.results as EstablishFindings;
    expect(referenceBins(report, results)).toEqual({
      step: 1,
      bins: [[137.5, 138.5, 1], [138.5, 139.5, 2], [139.5, 140.5, 3], [140.5, 141.5, 1], [141.5, 142.5, 0], [142.5, 143.5, 1]].map(([from, to, count]) => ({ from, to, count })),
    });
    // A stated step finer than the values (0.1 on whole numbers) bins and ticks in the values' own step, as on the page.
    const finer = { ...results, resolution: { ...results.resolution!, increment: 0.1 } };
    expect(referenceBins(report, finer)).toEqual(valueBins(values.slice(0, 8), 0.1));
    expect(referenceBins(report, finer).step).toBe(1);
  });

  it('prints a failed verification in words with the binomial probability and the advice', async () => {
    const report = verifyReport(20, { lower: 137, upper: 143 });
    const results = report.results as VerifyFindings;
    expect(results.accepted).toBe(false);
    const text = flat(pdfPages(await renderStudyReport(report)));
    expect(text).toContain(`Not accepted: ${results.outside} of ${results.n} values outside the stated interval (at most ${results.allowedOutside} allowed)`);
    expect(text).toContain(`P = ${results.probability.toFixed(3)} of ${results.outside} or more outside`);
    expect(text).toContain('test 20 more reference individuals');
    expect(text).toContain(`${results.n} local values`);
    expect(text.split('Outside the stated interval').length - 1).toBe(results.outside);
  });

  it("prints the stated interval's source the study gives, on results the app's analysis made (record-only, so not an input of the engine)", async () => {
    const report = verifyReport(20, { lower: 130, upper: 150 });
    // The analysis never sees the source (input-hash.ts analysedSettings leaves it out); the PDF must still name it.
    expect(report.settings.statedSource).toBe('Manufacturer’s insert, rev. 2025-06');
    const text = flat(pdfPages(await renderStudyReport(report)));
    expect(text).toContain('Source of the stated interval Manufacturer’s insert, rev. 2025-06 Values tested (n)');
    expect(text).not.toContain('Source of the stated interval — Values tested');
  });

  it('prints an accepted verification as accepted', async () => {
    const report = verifyReport(20, { lower: 130, upper: 150 });
    expect((report.results as VerifyFindings).accepted).toBe(true);
    const text = flat(pdfPages(await renderStudyReport(report)));
    expect(text).toContain('Accepted: 0 of 19 values outside the stated interval');
    expect(text).not.toContain('Not accepted');
  });

  it.each([
    ['method-comparison', comparisonReport(12)],
    ['interval-establish', establishReport(30)],
    ['interval-verify', verifyReport(20)],
  ] as const)('renders a %s study without an analysis, saying there are no findings', async (_kind, report) => {
    const pages = pdfPages(await renderStudyReport({ ...report, results: null, signature: null, draft: true }));
    expect(flat(pages)).toContain('so no findings are shown');
    expect(flat(pages[pages.length - 1])).toContain('Decision support only.');
  });

  it.each([
    ['method-comparison', comparisonReport(12)],
    ['interval-establish', establishReport(30)],
    ['interval-verify', verifyReport(20)],
  ] as const)('renders a %s study whose stored results lack fields without failing', async (_kind, report) => {
    // Results of the study's own kind (the registry's result name), with none of their fields.
    const partial = { kind: kindMeta(report.study.kind).resultKind } as unknown as StudyReport['results'];
    const pages = pdfPages(await renderStudyReport({ ...report, results: partial }));
    expect(flat(pages[0])).toContain(`Page 1 of ${pages.length}`);
    expect(flat(pages[pages.length - 1])).toContain('Decision support only.');
  });
});
