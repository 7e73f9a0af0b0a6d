import { renderStudyReport } from './render-report';
import type { ComparisonFindings, EstablishFindings, StudyReport } from './report-model';
import { comparisonReport, comparisonRows, establishReport, intervalRows, sodiumComparisonReport } from './testing/fixtures';
import { flat, pdfPages } from './testing/pdf-text';

// Written out here, not imported, so that a change of the printed wording fails a test.
const NARROW = 'CI narrower than one reporting step (1 mmol/L): the data cannot show a difference finer than the step.';
const RULE =
  "Results are reported in steps of 1 mmol/L (from the analyte's decimals). A confidence interval narrower than one step says nothing finer than the step; " +
  'a decision-level verdict is judged on an interval no narrower than the estimate ± half a step (0.5 mmol/L).';

const textOf = async (report: StudyReport): Promise<string> => flat(pdfPages(await renderStudyReport(report)));
const count = (text: string, phrase: string): number => text.split(phrase).length - 1;

/** Results as engine 1.1.0 stored them: no resolution, no judgedOn. */
function storedBeforeResolution(report: StudyReport): StudyReport {
  const results = JSON.parse(JSON.stringify(report.results)) as ComparisonFindings;
  delete (results as Partial<ComparisonFindings>).resolution;
  for (const d of results.decisionLevels) delete (d as Partial<typeof d>).judgedOn;
  return { ...report, results };
}

describe('the PDF of a comparison reported in whole mmol/L', () => {
  const report = sodiumComparisonReport(60);
  const results = report.results as ComparisonFindings;
  let pages: string[][];
  let text: string;

  beforeAll(async () => {
    pages = pdfPages(await renderStudyReport(report));
    text = flat(pages);
  });

  it('is built from a real analysis whose CIs collapse to one value', () => {
    expect(results.resolution.increment).toBe(1);
    expect(results.bias.median.ci).toEqual([1, 1]);
    expect(results.decisionLevels.map((d) => d.judgedOn)).toEqual([[0.5, 1.5], [0.5, 1.5]]);
  });

  it('states the rule once, on the page of the findings at the decision levels, before the sentence of each level', () => {
    expect(count(text, 'Results are reported in steps of')).toBe(1);
    const page = flat(pages.find((lines) => lines.includes('Findings at the decision levels'))!);
    expect(page).toContain(RULE);
    expect(page.indexOf(RULE)).toBeLessThan(page.indexOf('Within. At 130 mmol/L the predicted bias is'));
  });

  it('says beside the median bias, the SD and the intercept that their CI is narrower than the step, in the unit of each', () => {
    expect(text).toMatch(/Median bias 1\.0 mmol\/L 1\.0 to 1\.0 [<0-9.]+ [^A-Z]*CI narrower than one reporting step \(1 mmol\/L\): the data cannot show a difference finer than the step\./);
    // The intercept in the regression's sentence, the step's words right after it.
    expect(text).toMatch(new RegExp(`\\(intercept [−0-9.]+ mmol/L, 95% CI [−0-9.]+ to [−0-9.]+ mmol/L\\)\\. The CI [a-z]+ 0: [^.]+\\. ${NARROW.replace(/[().]/g, '\\$&')}`));
    expect(text).toContain('CI narrower than one reporting step (0.033 on the slope)');
  });

  it('says at each decision level on what interval the verdict was judged and why', () => {
    for (const at of ['130 mmol/L', '150 mmol/L']) {
      expect(text).toContain(
        `At ${at} the predicted bias is 1.0 mmol/L (95% CI 1.0 to 1.0). The CI is narrower than one reporting step (1 mmol/L), so the verdict is judged on ` +
        '0.5 to 1.5 mmol/L (the CI widened to the estimate ± half a step): that whole interval lies within the allowable ±2.0 mmol/L.',
      );
    }
    // Beside each track of the picture on page 1, and in the sentence of each level.
    expect(count(flat(pages[0]), 'judged on 0.5 to 1.5 mmol/L')).toBe(2);
    expect(count(text, 'judged on 0.5 to 1.5')).toBe(4);
    expect(flat(pages[0])).toContain('judged on: CI widened to ± half a reporting step');
  });
});

describe('the PDF of a glucose comparison in steps of 0.1 mmol/L with an excluded row', () => {
  it('marks the limited estimates of the analysed rows, in short, in the with-and-without table', async () => {
    const report = comparisonReport(40);
    const results = report.results as ComparisonFindings;
    expect(results.resolution.limitedEstimates).toContain('sd');
    expect(results.resolution.limitedEstimates).not.toContain('bias.mean');
    const lines = pdfPages(await renderStudyReport(report)).flat();
    // The with-and-without table's line: the estimate with its unit and its CI in brackets.
    const line = (start: string): string => lines.find((l) => l.startsWith(start) && / mmol\/L \(/.test(l))!;
    expect(line('SD of the differences')).toMatch(/^SD of the differences [0-9.]+ mmol\/L \([0-9.]+ to [0-9.]+\), CI narrower [0-9.]+ mmol\/L \([0-9.]+ to [0-9.]+\)$/);
    expect(line('Mean bias')).not.toContain('narrower');
    expect(flat(lines)).toMatch(/SD of the differences [0-9.]+ mmol\/L [0-9.]+ to [0-9.]+ CI narrower than one reporting step \(0\.1 mmol\/L\): the data cannot show a difference finer than the step\./);
  });
});

describe('the PDF of a comparison without coarse CIs', () => {
  it.each([
    ['fine-grained results', comparisonReport(40, { decimals: 2 }, comparisonRows(40, 2))],
    ['results stored by engine 1.1.0', storedBeforeResolution(sodiumComparisonReport(60))],
  ])('prints no word of the reporting step for %s', async (_name, report) => {
    expect((report.results as ComparisonFindings).resolution?.limitedEstimates ?? []).toEqual([]);
    const text = await textOf(report);
    expect(text).not.toContain('reporting step');
    expect(text).not.toContain('Results are reported in steps of');
    expect(text).not.toContain('judged on');
    expect(text).toContain('Findings at the decision levels');
  });
});

describe('the PDF of a reference interval in whole mmol/L', () => {
  it('states the rule once and names each limit, overall and per subgroup, whose CI is narrower than the step', async () => {
    const report = establishReport(130, intervalRows(130, 0.8, 3));
    const results = report.results as EstablishFindings;
    expect(results.resolution.limitedEstimates).toEqual(['upper', 'partitions.0.intervals.0.lower', 'partitions.0.intervals.0.upper', 'partitions.0.intervals.1.lower']);
    const text = await textOf(report);
    expect(count(text, "Results are reported in steps of 1 mmol/L (from the analyte's decimals). A confidence interval narrower than one step says nothing finer than the step.")).toBe(1);
    expect(text).toContain(`Upper limit: bootstrap ${NARROW}`);
    expect(text).not.toContain(`Lower limit: bootstrap ${NARROW}`);
    expect(text).toContain(`Sex F, lower limit: bootstrap ${NARROW}`);
    expect(text).toContain(`Sex F, upper limit: bootstrap ${NARROW}`);
    expect(text).toContain(`Sex M, lower limit: bootstrap ${NARROW}`);
    expect(text).not.toContain('Sex M, upper limit');
  });

  it('prints no word of the reporting step when no limit is limited by it', async () => {
    const report = establishReport(130);
    expect((report.results as EstablishFindings).resolution.limitedEstimates).toEqual([]);
    expect(await textOf(report)).not.toContain('reporting step');
  });
});
