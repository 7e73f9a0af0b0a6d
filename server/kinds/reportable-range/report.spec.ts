import ExcelJS from 'exceljs';
import type { RangeLevelResult, RangeResult } from '@shared/stats/reportable-range-types';
import { resultsSheet } from '../../audit/results-sheet';
import { renderStudyReport } from '../../reports/render-report';
import type { StudyReport } from '../../reports/report-model';
import { bodyLines, pdfLayout } from '../../reports/testing/pdf-layout';
import { flat, pdfPages } from '../../reports/testing/pdf-text';
import { PAGE } from '../../reports/theme';
import { serverKind } from '..';
import { reportableRangeKind } from '.';
import { EXCLUDED_REASON, GOAL_SOURCE, LEVEL_VALUES, rangeRows, rangeStudyReport } from './report-fixture';
import { rangeSheet } from './results-sheet';

// Written out here, not imported, so that a change of the printed wording fails a test.
const CAUTION =
  "Decision support only. These findings do not by themselves make a verification compliant: final acceptance follows local accreditation rules and the laboratory director's professional judgement. They hold only for the specimen types, measuring range, population and lots studied.";

const resultsOf = (report: StudyReport): RangeResult => report.results as unknown as RangeResult;
/** A number as the report writes it: fixed decimals and a true minus sign. */
const t = (v: number, d: number): string => `${v < 0 && Number(Math.abs(v).toFixed(d)) !== 0 ? '−' : ''}${Math.abs(v).toFixed(d)}`;
const level = (r: RangeResult, name: string): RangeLevelResult => r.levels.find((l) => l.level === name)!;

/** Every page: no body text below the footer zone, no page ending with a heading, no page but the last mostly empty. */
async function expectLaidOut(report: StudyReport): Promise<void> {
  const laid = pdfLayout(await renderStudyReport(report));
  laid.forEach((page, k) => {
    const body = bodyLines(page);
    const last = body[body.length - 1];
    expect({ page: k + 1, below: body.filter((l) => l.top + l.size > page.height - PAGE.bottom + 1).map((l) => l.text) }).toEqual({ page: k + 1, below: [] });
    expect({ page: k + 1, above: body.filter((l) => l.top < PAGE.top - 1).map((l) => l.text) }).toEqual({ page: k + 1, above: [] });
    // Headings are 12.5 pt and subheadings 10 pt; no other text is set in those sizes.
    expect({ page: k + 1, last: last.text, heading: [12.5, 10].includes(last.size) }).toEqual({ page: k + 1, last: last.text, heading: false });
    if (k < laid.length - 1) expect((last.top + last.size) / page.height).toBeGreaterThan(0.5);
  });
}

describe('the report of a reportable-range study', () => {
  const report = rangeStudyReport();
  const results = resultsOf(report);
  const top = level(results, 'Level 7');
  const five = level(results, 'Level 5');
  let pdf: Buffer;
  let pages: string[][];
  let text: string;

  beforeAll(async () => {
    pdf = await renderStudyReport(report);
    pages = pdfPages(pdf);
    text = flat(pages);
  });

  it('is built from a real analysis: the top level curves off beyond the goal, so the range is shortened to levels 1 to 6', () => {
    expect(results.kind).toBe('reportable-range');
    expect(results.verdict).toBe('range-shortened');
    expect(results.levels.map((l) => l.within)).toEqual([true, true, true, true, true, true, false]);
    expect(results.verifiedRange).toEqual({ low: 2, high: 27, lowLevel: 'Level 1', highLevel: 'Level 6' });
    expect(results.bestDegree).toBeGreaterThan(1);
    expect(five.ciBeyondGoal).toBe(true);
    expect(results.excludedCount).toBe(1);
    expect(results.levels.map((l) => l.n)).toEqual([2, 2, 2, 2, 2, 2, 2]);
  });

  it('asks the registry for its title, kind and body', () => {
    expect(serverKind('reportable-range').report).toBe(reportableRangeKind.report);
    expect(flat(pages[0])).toContain('Reportable range verification: study report');
    expect(text).toContain('Kind of study Reportable range (linearity and recovery)');
  });

  it('leads page 1 with the verdict, its sentence, the range against the claim, the goal and its source, the best fit, the counts, the caution and the sign-off', () => {
    const page1 = flat(pages[0]);
    const best = results.fits.find((f) => f.degree === results.bestDegree)!;
    const names: Record<number, string> = { 2: 'The quadratic (degree 2)', 3: 'The cubic (degree 3)' };
    const order = [
      'CONCLUSION: REPORTABLE RANGE SHORTENED Shortened: the deviation from linearity exceeds the allowable nonlinearity at level "Level 7"; ' +
      'the reportable range is verified only from 2.0 to 27.0 mmol/L (levels "Level 1" to "Level 6"). It does not reach the claimed high end (32.0 mmol/L).',
      'Verified range 2.0 to 27.0 mmol/L (levels "Level 1" to "Level 6") Claimed measuring interval 2.0 to 32.0 mmol/L',
      `Allowable nonlinearity 0.5 mmol/L or 1.5% of the level, whichever is larger; source: ${GOAL_SOURCE}`,
      `Best fit ${names[results.bestDegree]} fits best: its top coefficient differs from 0 (p = ${best.p!.toFixed(3)}, α = 0.05).`,
      'Results 14 used of 15 entered; 1 excluded',
      `Caution ${CAUTION}`,
      'Sign-off Signed by Dr. Imani Okafor',
    ];
    const at = order.map((phrase) => page1.indexOf(phrase));
    expect(at).not.toContain(-1);
    expect([...at].sort((a, b) => a - b)).toEqual(at);
    expect(text.indexOf('Plan and acceptance criteria')).toBeGreaterThan(text.indexOf('Verification code PX-7Q3L-R2KD'));
    expect(text.indexOf('Linearity')).toBeGreaterThan(text.indexOf('Plan and acceptance criteria'));
  });

  it('prints the plan: levels and replicates, the goal and its source, the claimed interval, α, the bootstrap, the rules and each level', () => {
    const plan = text.slice(text.indexOf('Plan and acceptance criteria'), text.indexOf('Linearity'));
    expect(plan).toContain('Levels 7 levels × 2 replicates (14 results planned); each level below');
    expect(plan).toContain('Allowable nonlinearity 0.5 mmol/L or 1.5% of the level, whichever is larger');
    expect(plan).toContain(`Source of the allowable ${GOAL_SOURCE.split(' ').slice(0, 9).join(' ')}`);
    expect(plan).toContain('Claimed measuring interval 2.0 to 32.0 mmol/L');
    expect(plan).toContain('Significance level α = 0.05, for the t-test of each polynomial’s top coefficient');
    expect(plan).toContain('Bootstrap 95% percentile CIs of the deviations from 2,000 resamples of the replicates within each level, seed "range-report-test"');
    expect(plan).toContain('Acceptance rule (as planned) At each level the deviation of the best-fitting polynomial from the straight line');
    expect(plan).toContain('Outlier rule Flag a level whose replicate variance is the largest by Cochran');
    expect(plan).toContain('Plan approval Approved by Dr. Imani Okafor, 2026-11-20 08:30 America/Halifax');
    expect(plan).toContain('Levels as planned Level Assigned value (mmol/L) Level 1 2.0 Level 2 7.0 Level 3 12.0 Level 4 17.0 Level 5 22.0 Level 6 27.0 Level 7 32.0');
    // No level is a mixture: no fraction column and no pools.
    expect(plan).not.toContain('Fraction of the high pool');
    expect(plan).not.toContain('Pools');
  });

  it('draws the results against the assigned value with the straight line, the best fit and the allowable band, as vector paths', () => {
    const section = text.slice(text.indexOf('Linearity'), text.indexOf('Deviation from linearity at each level, against'));
    expect(section).toContain('Results against the assigned value');
    expect(section).toContain('Urea (mmol/L)');
    expect(section).toContain('Assigned value (mmol/L)');
    expect(section).toContain('result level mean mean of a level beyond the goal straight line best fit (cubic) allowable nonlinearity around the straight line');
    expect(pdf.toString('latin1')).not.toContain('/Subtype /Image');
  });

  it('draws the deviation at each level against its band, with the judgement and its numbers in words', () => {
    const picture = text.slice(text.indexOf('Deviation from linearity at each level, against the allowable nonlinearity'), text.indexOf('Results at each level'));
    const track = (l: RangeLevelResult, word: string): string =>
      `${l.level} ${word} ${t(l.assigned!, 1)} mmol/L deviation ${t(l.deviation, 2)} mmol/L (${t(l.deviationPercent!, 1)}%) ` +
      `95% CI ${t(l.deviationCi![0], 2)} to ${t(l.deviationCi![1], 2)} mmol/L allowable ±${t(l.goal, 2)} mmol/L`;
    expect(picture).toContain(track(top, 'Beyond the goal'));
    expect(picture).toContain(track(five, 'Within (CI reaches beyond)'));
    expect(picture).toContain(track(level(results, 'Level 3'), 'Within'));
    expect(picture).toContain('Deviation of the best fit from the straight line (mmol/L)');
    expect(picture).toContain('within within, its CI reaching beyond beyond the goal 95% CI');
    expect(picture).toContain(`Allowable nonlinearity 0.5 mmol/L or 1.5% of the level, whichever is larger (source: ${GOAL_SOURCE.split(' ').slice(0, 6).join(' ')}`);
  });

  it('prints a table of the levels’ results and recovery, and one of the deviations with the judgement in words', () => {
    expect(text).toContain('Results at each level Level Assigned (mmol/L) n Mean (mmol/L) SD (mmol/L) Recovery %');
    expect(text).toContain(`Level 7 32.0 2 30.50 ${t(top.sd!, 2)} ${t(top.recoveryPercent!, 1)}%`);
    expect(text).toContain(`Level 1 2.0 2 2.05 ${t(results.levels[0].sd!, 2)} 102.5%`);
    expect(text).toContain(
      `Level 7 ${t(top.linear, 2)} ${t(top.fitted, 2)} ${t(top.deviation, 2)} ${t(top.deviationPercent!, 1)}% ${t(top.deviationCi![0], 2)} to ${t(top.deviationCi![1], 2)} ±${t(top.goal, 2)} Beyond the goal`,
    );
    // "Within (CI reaches beyond)" takes two lines of its cell.
    expect(text).toContain(`Level 5 ${t(five.linear, 2)} ${t(five.fitted, 2)} ${t(five.deviation, 2)} ${t(five.deviationPercent!, 1)}% ${t(five.deviationCi![0], 2)} to ${t(five.deviationCi![1], 2)} ±${t(five.goal, 2)} Within (CI`);
  });

  it('prints each polynomial with its coefficients, SEs, p and Sy.x, the best one named, then the warnings and the design', () => {
    const fits = text.slice(text.indexOf('Polynomial fits'), text.indexOf('Design of the analysis'));
    const line = results.fits[0];
    expect(fits).toContain('Degree Coefficients (y = b0 + b1·x + …) Standard errors p of the top Sy.x Judgement');
    expect(fits).toContain(`1 b0 = ${Number(line.coefficients[0].toPrecision(6))} ${Number(line.se[0].toPrecision(6))} — ${t(line.syx, 2)}`);
    const best = results.fits.find((f) => f.degree === results.bestDegree)!;
    expect(fits).toContain(`${best.degree} b0 = ${Number(best.coefficients[0].toPrecision(6)).toString().replace('-', '−')} ${Number(best.se[0].toPrecision(6))} ${best.p!.toFixed(3)} ${t(best.syx, 2)} Best fit`);
    expect(fits).toContain('fits best: its top coefficient differs from 0');
    expect(fits).toContain('Warnings •  With 3 or fewer results a level'.replace(/\s+/g, ' '));
    expect(fits).toContain('At "Level 5" the deviation is within the goal but its CI reaches beyond it');
    expect(text).toContain(
      'Design of the analysis Levels with results 7 Results analysed 14 Excluded with a reason 1 Levels given as assigned values ' +
      'Allowable nonlinearity 0.5 mmol/L or 1.5% of the level, whichever is larger Claimed measuring interval 2.0 to 32.0 mmol/L ' +
      'Significance level α (top coefficients) 0.05 CIs of the deviations 95% percentile bootstrap, 2,000 resamples within levels',
    );
  });

  it('lists the exclusion with its reason and every row as typed, with level and replicate', () => {
    expect(text).toContain(`Exclusions Row Level Replicate Result Reason 8 Level 4 2 15.2 ${EXCLUDED_REASON.split(' ').slice(0, 8).join(' ')}`);
    const lines = pages.flat();
    const rows = lines.slice(lines.indexOf('Results as entered')).filter((l) => /^\d+ Level \d \d /.test(l));
    expect(rows.map((l) => Number(l.split(' ')[0]))).toEqual(report.rows.map((r) => r.position));
    for (const r of report.rows) expect(rows[r.position - 1]).toContain(`${r.position} ${r.level} ${r.replicate} ${r.valueText}`);
    expect(text).toContain('Excluded: Short sample');
    expect(text).toContain('Run again after the short sample: first result 15.2');
  });

  it('prints the caution on page 1 and again on the last page, and the footer on every page', () => {
    expect(flat(pages[0])).toContain(CAUTION);
    expect(flat(pages[pages.length - 1])).toContain(CAUTION);
    pages.forEach((lines, k) => expect(flat(lines)).toContain(`Page ${k + 1} of ${pages.length}`));
  });

  it('gives the same bytes for the same study, built and analysed twice', async () => {
    const again = await renderStudyReport(rangeStudyReport());
    expect(again.equals(pdf)).toBe(true);
    const other = await renderStudyReport(rangeStudyReport(rangeRows(), { allowableNonlinearity: 0.8 }));
    expect(other.equals(pdf)).toBe(false);
  });

  it('keeps every line inside the page, never ends a page with a heading and leaves no early page mostly empty', async () => {
    await expectLaidOut(report);
    await expectLaidOut({ ...report, draft: true, signature: null });
  });
});

describe('a reportable-range report in other states', () => {
  it('says there is no current analysis without results, and still prints the plan, the study and the rows', async () => {
    const report = { ...rangeStudyReport(), results: null, signature: null, draft: true };
    const pages = pdfPages(await renderStudyReport(report));
    const text = flat(pages);
    expect(text).toContain('CONCLUSION There is no current analysis of these results and goals, so no findings are shown.');
    expect(text).toContain('Plan and acceptance criteria');
    expect(text).toContain('Levels as planned');
    expect(text).toContain('Results as entered');
    expect(text).not.toContain('Linearity');
    expect(text).not.toContain('Polynomial fits');
    expect(flat(pages[pages.length - 1])).toContain('Decision support only.');
    await expectLaidOut(report);
  });

  it('renders stored results that lack fields without failing', async () => {
    const report = { ...rangeStudyReport(), results: { kind: 'reportable-range' } as unknown as StudyReport['results'] };
    const text = flat(pdfPages(await renderStudyReport(report)));
    expect(text).toContain('No level could be analysed; see the warnings.');
    expect(text).toContain('No polynomial could be fitted; see the warnings.');
    expect(text).toContain('Decision support only.');
  });

  it('says the straight line fits best when the top level does not curve off: every level within, no CIs, no level marked beyond', async () => {
    const straight = LEVEL_VALUES.map((v, i) => (i === 6 ? [32.1, 31.9] : [[2.0, 2.1], [7.1, 6.9], [12.0, 12.1], [17.1, 16.9], [21.9, 22.1], [27.0, 26.8]][i]));
    const report = rangeStudyReport(rangeRows(straight));
    const r = resultsOf(report);
    expect([r.verdict, r.bestDegree]).toEqual(['range-verified', 1]);
    const text = flat(pdfPages(await renderStudyReport(report)));
    expect(text).toContain(
      'CONCLUSION: REPORTABLE RANGE VERIFIED Verified: at all 7 levels the deviation from linearity lies within the allowable nonlinearity; ' +
      'the reportable range is verified from 2.0 to 32.0 mmol/L (levels "Level 1" to "Level 7"). It covers the claimed measuring interval.',
    );
    expect(text).toContain('The straight line fits best: no higher-degree top coefficient differs from 0 at α = 0.05, so the deviation from linearity is 0 at every level.');
    expect(text).toContain('result level mean straight line allowable nonlinearity around the straight line');
    expect(text).not.toContain('mean of a level beyond the goal');
    expect(text).toContain('Level 7 Within 32.0 mmol/L deviation 0.00 mmol/L (0.0%) no CI: the straight line fits best allowable ±0.50 mmol/L');
    expect(text).toContain('CIs of the deviations none: the straight line fits best (no resampling)');
    await expectLaidOut(report);
  });

  it('draws levels given as fractions of the high pool against the fraction, without recovery', async () => {
    const levels = LEVEL_VALUES.map((v, i) => ({ name: `Level ${i + 1}`, fraction: (v - 2) / 30, assigned: null }));
    const report = rangeStudyReport(rangeRows(), { levels, claimedLow: null, claimedHigh: null });
    const r = resultsOf(report);
    expect(r.basis).toBe('fraction');
    const text = flat(pdfPages(await renderStudyReport({ ...report, draft: true, signature: null })));
    expect(text).toContain('Pools Not given: the levels are drawn against the fraction of the high pool, without recovery');
    expect(text).toContain('Levels as planned Level Assigned value (mmol/L) Fraction of the high pool Level 1 — 0 Level 2 — 0.166667 Level 3 — 0.333333');
    expect(text).toContain('Results against the fraction of the high pool');
    expect(text).toContain('Fraction of the high pool');
    expect(text).toContain(`Level 7 1.000 2 30.50 ${t(level(r, 'Level 7').sd!, 2)} —`);
    expect(text).toContain('Claimed measuring interval not stated');
    await expectLaidOut(report);
  });

  it('plans levels mixed from two pools with the values the pools give them', async () => {
    const levels = [0, 0.25, 0.5, 0.75, 1].map((fraction, i) => ({ name: `Level ${i + 1}`, fraction, assigned: null }));
    const rows = rangeRows([[2.0, 2.1], [9.6, 9.4], [17.1, 16.9], [24.5, 24.6], [31.8, 32.1]]);
    const report = rangeStudyReport(rows, { levels, poolLow: 2, poolHigh: 32 });
    expect(resultsOf(report).basis).toBe('assigned');
    const text = flat(pdfPages(await renderStudyReport(report)));
    expect(text).toContain('Pools low 2.0 mmol/L, high 32.0 mmol/L');
    expect(text).toContain('Level 2 9.5 (from the pools) 0.25');
    expect(text).toContain('Results against the assigned value');
  });
});

describe('the Results sheet of a reportable-range study', () => {
  const report = rangeStudyReport();
  const results = resultsOf(report);
  const lines = rangeSheet.lines(results, 'mmol/L', 1);
  const line = (section: string, name: string) => lines.find((l) => l.section === section && l.name === name)!;
  const top = level(results, 'Level 7');

  it('gives the deviations’ CIs at the study’s confidence level, with a column for every level figure and every coefficient', () => {
    expect(rangeSheet.level(results)).toBe(0.95);
    expect(rangeSheet.level({ kind: 'reportable-range', confidenceLevel: 0.9 })).toBe(0.9);
    expect(rangeSheet.columns(0.95).map((c) => c.header)).toEqual([
      'Section', 'Estimate', 'Value', 'Assigned value', 'Fraction of the high pool', 'n', 'Mean', 'SD', 'Straight line', 'Best fit', 'Deviation',
      'Deviation %', '95% CI of the deviation, low', '95% CI of the deviation, high', 'Allowable (±)', 'Recovery %', 'Degree',
      'b0', 'b1', 'b2', 'b3', 'SE of b0', 'SE of b1', 'SE of b2', 'SE of b3', 'p of the top coefficient', 'Sy.x', 'Unit', 'In words',
    ]);
    expect(rangeSheet.columns(0.95).filter((c) => c.numeric).map((c) => c.key)).not.toContain('unit');
  });

  it('writes the verdict, the verified and claimed ranges and the goal with their numbers and the PDF’s sentences', () => {
    expect(line('Reportable range', 'Verdict').words).toBe(
      'Shortened: the deviation from linearity exceeds the allowable nonlinearity at level "Level 7"; the reportable range is verified only from 2.0 to 27.0 mmol/L ' +
      '(levels "Level 1" to "Level 6"). It does not reach the claimed high end (32.0 mmol/L).',
    );
    expect(line('Reportable range', 'Verified range, low end')).toMatchObject({ cells: { value: 2, unit: 'mmol/L' }, formats: { value: '0.0' }, words: '2.0 to 27.0 mmol/L (levels "Level 1" to "Level 6")' });
    expect(line('Reportable range', 'Verified range, high end').cells).toEqual({ value: 27, unit: 'mmol/L' });
    expect(line('Reportable range', 'Claimed measuring interval, high end').cells).toEqual({ value: 32, unit: 'mmol/L' });
    expect(line('Reportable range', 'Allowable nonlinearity')).toMatchObject({
      cells: { value: 0.5, unit: 'mmol/L' }, words: `0.5 mmol/L or 1.5% of the level, whichever is larger; source: ${GOAL_SOURCE}`,
    });
    expect(line('Reportable range', 'Allowable nonlinearity, % of the level')).toMatchObject({ cells: { value: 1.5, unit: '%' }, formats: { value: '0.0' } });
    expect(line('Reportable range', 'Best-fitting degree').cells).toEqual({ value: results.bestDegree });
    expect(line('Reportable range', 'Results excluded').cells).toEqual({ value: 1 });
  });

  it('writes one line per level, numbers as numbers in the tables’ decimals, and the judgement in words', () => {
    expect(line('Levels', 'Level 7')).toEqual({
      section: 'Levels', name: 'Level 7',
      cells: {
        assigned: 32, fraction: null, n: 2, mean: top.mean, sd: top.sd, linear: top.linear, fitted: top.fitted, deviation: top.deviation,
        deviationPercent: top.deviationPercent, ciLow: top.deviationCi![0], ciHigh: top.deviationCi![1], goal: top.goal, recovery: top.recoveryPercent, unit: 'mmol/L',
      },
      formats: {
        assigned: '0.0', fraction: '0.000', n: '0', mean: '0.00', sd: '0.00', linear: '0.00', fitted: '0.00', deviation: '0.00', deviationPercent: '0.0',
        ciLow: '0.00', ciHigh: '0.00', goal: '0.00', recovery: '0.0',
      },
      words: 'Beyond the goal',
    });
    expect(line('Levels', 'Level 5').words).toBe('Within (CI reaches beyond)');
    expect(line('Levels', 'Level 1').words).toBe('Within');
    expect(lines.filter((l) => l.section === 'Levels').map((l) => l.name)).toEqual(results.levels.map((l) => l.level));
  });

  it('writes one line per polynomial with its coefficients, SEs, p and Sy.x', () => {
    const fits = lines.filter((l) => l.section === 'Polynomial fits');
    expect(fits.map((l) => l.name)).toEqual(results.fits.map((f) => `${{ 1: 'Straight line', 2: 'Quadratic', 3: 'Cubic' }[f.degree]} (degree ${f.degree})`));
    const cubic = results.fits.find((f) => f.degree === 3)!;
    expect(fits[2].cells).toEqual({
      degree: 3, p: cubic.p, syx: cubic.syx, unit: 'mmol/L',
      b0: cubic.coefficients[0], b1: cubic.coefficients[1], b2: cubic.coefficients[2], b3: cubic.coefficients[3],
      se0: cubic.se[0], se1: cubic.se[1], se2: cubic.se[2], se3: cubic.se[3],
    });
    expect(fits[2].words).toBe(results.bestDegree === 3 ? 'Best fit' : 'Top coefficient differs from 0');
    expect(fits[0].cells).toMatchObject({ degree: 1, p: null });
    expect(fits[0].cells).not.toHaveProperty('b2');
    expect(lines.filter((l) => l.section === 'Warnings').map((l) => l.words)).toEqual(results.warnings);
  });

  it('fills the workbook’s Results sheet through the registry, numbers as numbers', async () => {
    const wb = new ExcelJS.Workbook();
    const ws = resultsSheet(wb, serverKind('reportable-range'), results, { unit: 'mmol/L', decimals: 1, heading: { analysis: 'Analysis 1', findings: 'Current' } });
    const rows = ws.getSheetValues().filter(Boolean) as unknown[][];
    const seven = rows.find((r) => r[1] === 'Levels' && r[2] === 'Level 7')!;
    // Columns: 1 section, 2 name, 3 value, 4 assigned, 5 fraction, 6 n, 7 mean … 16 recovery; the unit and the words at the end.
    expect(seven.slice(4, 17)).toEqual([32, undefined, 2, top.mean, top.sd, top.linear, top.fitted, top.deviation, top.deviationPercent, top.deviationCi![0], top.deviationCi![1], top.goal, top.recoveryPercent]);
    expect(seven.slice(-2)).toEqual(['mmol/L', 'Beyond the goal']);
    expect(ws.getRow(rows.indexOf(seven) + 1).getCell('mean').numFmt).toBe('0.00');
    const buffer = await wb.xlsx.writeBuffer();
    expect(buffer.byteLength).toBeGreaterThan(1000);
  });
});
