import { createHash } from 'node:crypto';
import ExcelJS from 'exceljs';
import { parseKindSettings } from '@shared/kinds/settings';
import { analyzePrecision } from '@shared/stats/analyze-precision';
import type { PrecisionMaterialResult, PrecisionMaterialSetting, PrecisionResult, PrecisionRow } from '@shared/stats/precision-types';
import { resultsSheet } from '../../audit/results-sheet';
import { renderStudyReport } from '../../reports/render-report';
import type { ReportRow, StudyReport } from '../../reports/report-model';
import { sequence } from '../../reports/testing/fixtures';
import { bodyLines, pdfLayout } from '../../reports/testing/pdf-layout';
import { flat, pdfPages } from '../../reports/testing/pdf-text';
import { PAGE } from '../../reports/theme';
import { serverKind } from '..';
import { PRECISION_OUTLIER_RULE, precisionKind } from '.';
import { precisionSheet } from './results-sheet';

// Written out here, not imported, so that a change of the printed wording fails a test.
const CAUTION =
  "Decision support only. These findings do not by themselves make a verification compliant: final acceptance follows local accreditation rules and the laboratory director's professional judgement. They hold only for the specimen types, measuring range, population and lots studied.";

const DAYS = ['2026-11-09', '2026-11-10', '2026-11-11', '2026-11-12', '2026-11-13'];
const LEVEL_1 = 'K control level 1';
const LEVEL_2 = 'K control level 2';
const EXCLUDED_REASON = 'Clot flagged by the analyser; replicate 3 run again from the same vial';

/**
 * An invented potassium control at two levels, 5 days × 5 replicates each, in mmol/L to 0.01: level 1 steady
 * (claims as SDs, an assigned value from the control's insert), level 2 with a day-to-day shift (claims as
 * CVs), so its within-laboratory CV lies above its claim. One extra replicate of level 1 is excluded with a reason.
 */
function potassiumRows(days = DAYS, replicates = 5, outlier = false): ReportRow[] {
  const next = sequence(20261115);
  const normal = (): number => Math.sqrt(-2 * Math.log(next())) * Math.cos(2 * Math.PI * next());
  const levels = [
    { name: LEVEL_1, mean: 3.52, sr: 0.035, sb: 0.012, shift: days.map(() => 0) },
    { name: LEVEL_2, mean: 6.48, sr: 0.05, sb: 0.01, shift: days.map((_, i) => [0, 0.07, -0.05, 0.09, -0.04][i % 5]) },
  ].slice(0, outlier ? 1 : 2);
  const rows: Omit<ReportRow, 'position'>[] = [];
  for (const level of levels) {
    days.forEach((day, i) => {
      const shift = level.sb * normal() + level.shift[i];
      for (let replicate = 1; replicate <= replicates; replicate++) {
        const value = Number((level.mean + shift + level.sr * normal() + (outlier && i === 2 && replicate === 4 ? 0.45 : 0)).toFixed(2));
        const row = { label: '', comparative: null, candidate: null, value, valueText: value.toFixed(2), sex: null, ageBand: null, excluded: false, exclusionReason: null, note: '', material: level.name, day, replicate };
        if (!outlier && level.name === LEVEL_1 && i === 1 && replicate === 3) {
          rows.push({ ...row, value: 3.81, valueText: '3.81', excluded: true, exclusionReason: EXCLUDED_REASON });
          rows.push({ ...row, note: 'Run again after the clot: first result 3.81 mmol/L' });
        } else rows.push(row);
      }
    });
  }
  return rows.map((r, k) => ({ ...r, position: k + 1 }) as ReportRow);
}

const MATERIALS = [
  { name: LEVEL_1, claimRepeatability: 0.04, claimWithinLab: 0.05, claimAs: 'sd', assignedValue: 3.5, assignedUncertainty: 0.02, assignedSource: 'Control insert, lot KC-2611 (manufacturer’s mean)' },
  { name: LEVEL_2, claimRepeatability: 1.0, claimWithinLab: 1.2, claimAs: 'cv', assignedValue: null, assignedUncertainty: null, assignedSource: '' },
] as const;

/** A precision study of `rows`, analysed by analyzePrecision as the worker would, in a report like those the other kinds' tests use. */
function precisionReport(rows = potassiumRows(), materials: readonly PrecisionMaterialSetting[] = MATERIALS, plan = { days: 5, replicates: 5 }): StudyReport {
  const settings = parseKindSettings('precision', {
    ...precisionKind.initialSettings({} as never), decimals: 2, unit: 'mmol/L', seed: 'report-test', reagentLot: 'K-ISE-2611',
    runsFrom: DAYS[0], runsTo: DAYS[4], materials, ...plan, alpha: 0.05, controlLot: 'KC-2611',
  });
  const results = analyzePrecision(rows.map((r): PrecisionRow => ({
    material: String(r.material), day: String(r.day), replicate: r.replicate as number, value: r.value!, excluded: r.excluded,
    exclusionReason: r.exclusionReason ?? undefined, position: r.position,
  })), { materials: materials.map((m) => ({ ...m })), days: plan.days, replicates: plan.replicates, alpha: 0.05, decimals: 2, seed: 'report-test' });
  return {
    laboratory: { name: 'Vale Harbor Regional Laboratory', timeZone: 'America/Halifax' },
    study: { id: 57, kind: 'precision', title: 'Potassium, serum: precision of the new chemistry analyser', purpose: 'Verify the manufacturer’s precision claims before the analyser reports patient results.', state: 'signed', supersedesId: null },
    analyte: { name: 'Potassium', unit: 'mmol/L' },
    instruments: { instrument: { name: 'Satellite chemistry 2', model: 'Harborline C-350', serial: 'HL3-10988' } },
    settings, engineVersion: results.engine.version, rows, results: results as unknown as StudyReport['results'],
    amendments: [],
    planApproval: { signerName: 'Dr. Imani Okafor', signedAt: new Date('2026-11-02T12:30:00Z'), comment: 'Two levels near the decision limits' },
    signature: { signerName: 'Dr. Imani Okafor', meaning: 'accepted', comment: 'Level 2 within-laboratory CV above the claim but within its limit; watch the daily QC.', signedAt: new Date('2026-12-02T13:14:00Z') },
    contentHash: createHash('sha256').update(JSON.stringify({ rows, settings })).digest('hex'),
    verificationCode: 'PX-8R2C-W4LM',
    draft: false,
    generatedAt: new Date('2026-12-02T13:14:30Z'),
  };
}

const resultsOf = (report: StudyReport): PrecisionResult => report.results as unknown as PrecisionResult;
const material = (report: StudyReport, name: string): PrecisionMaterialResult => resultsOf(report).materials.find((m) => m.name === name)!;
const f = (v: number, d: number): string => v.toFixed(d);

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

describe('the report of a precision verification', () => {
  const report = precisionReport();
  const one = material(report, LEVEL_1);
  const two = material(report, LEVEL_2);
  let pages: string[][];
  let text: string;

  beforeAll(async () => {
    pages = pdfPages(await renderStudyReport(report));
    text = flat(pages);
  });

  it('is built from a real analysis: level 1 verified, level 2 repeatability verified and within-laboratory consistent with the claim', () => {
    expect(resultsOf(report).kind).toBe('precision');
    expect(resultsOf(report).excludedCount).toBe(1);
    expect([one.n, one.days, two.n, two.days]).toEqual([25, 5, 25, 5]);
    expect(one.verdicts).toEqual({ repeatability: 'verified', withinLab: 'verified' });
    expect(two.verdicts).toEqual({ repeatability: 'verified', withinLab: 'consistent' });
    expect(one.trueness?.verdict).toBe('verified');
    expect(two.trueness).toBeNull();
  });

  it('asks the registry for its title, kind and body', () => {
    expect(serverKind('precision').report).toBe(precisionKind.report);
    expect(flat(pages[0])).toContain('Precision verification: study report');
    expect(text).toContain('Kind of study Precision verification (days × replicates)');
  });

  it('leads page 1 with the overall verdict and each material judged in the findings’ sentences, then the counts, the caution, the sign-off and the plan', () => {
    const page1 = flat(pages[0]);
    const t = one.trueness!;
    // The sentences of the Findings panel (shared/kinds/precision/words.ts), written out here.
    const overall = '4 claims over 2 materials: 3 verified, 1 consistent with the claim, 0 not verified. Trueness verified for 1 of 1 material with an assigned value.';
    const level1 = `${LEVEL_1} — Repeatability verified: SD ${f(one.repeatability.sd, 3)} mmol/L is within the claim 0.040 mmol/L. ` +
      `Within-laboratory precision verified: SD ${f(one.withinLab.sd, 3)} mmol/L is within the claim 0.050 mmol/L. ` +
      `Trueness verified: the mean ${f(one.mean, 3)} mmol/L lies within the verification interval ${f(t.interval.lower, 3)} to ${f(t.interval.upper, 3)} mmol/L ` +
      `around the assigned value 3.50 mmol/L (bias ${f(t.bias, 3)} mmol/L, ${f(t.biasPercent, 1)}%).`;
    const level2 = `${LEVEL_2} — Repeatability verified: CV ${f(two.repeatability.cv, 1)}% is within the claim 1.0%. ` +
      `Within-laboratory precision consistent with the claim: CV ${f(two.withinLab.cv, 1)}% exceeds the claim 1.2% but not the upper verification limit ${f(two.uvl.withinLab, 1)}% (α = 0.05, 2 materials).`;
    const order = [
      `CONCLUSION ${overall} ${level1} ${level2} Results`,
      'Results 50 used of 51 entered; 1 excluded Caution',
      `Caution ${CAUTION}`,
      'Sign-off Signed by Dr. Imani Okafor',
    ];
    const at = order.map((phrase) => page1.indexOf(phrase));
    expect(at).not.toContain(-1);
    expect([...at].sort((a, b) => a - b)).toEqual(at);
    expect(text.indexOf('Plan and acceptance criteria')).toBeGreaterThan(text.indexOf('Verification code PX-8R2C-W4LM'));
    expect(page1).not.toContain('Material: ');
  });

  it('prints the plan: design, α shared by the materials, the rules, and each claim as an SD or a CV with the assigned value and its source', () => {
    const plan = text.slice(text.indexOf('Plan and acceptance criteria'), text.indexOf('Material: '));
    expect(plan).toContain('Design 5 days × 5 replicates a day for each material (25 results each), one run a day');
    expect(plan).toContain('Significance level α = 0.05, shared by the 2 materials (α/2 for each upper verification limit)');
    expect(plan).toContain('Control material lot KC-2611');
    expect(plan).toContain(`Outlier rule ${PRECISION_OUTLIER_RULE}`);
    expect(plan).toContain('Acceptance rule (as planned) Each SD within its claim, or within the upper verification limit');
    expect(plan).toContain('Plan approval Approved by Dr. Imani Okafor');
    expect(plan).toContain('Materials, claims and assigned values Material Claims as Repeatability Within-laboratory Assigned value Source of the assigned value');
    expect(plan).toContain('K control level 1 SD, mmol/L 0.040 0.050 3.50 mmol/L (u = 0.02');
    expect(plan).toContain('u: the standard uncertainty of the assigned value.');
    expect(plan).toContain('Control insert, lot');
    expect(plan).toContain('KC-2611 (manufacturer’s mean)');
    expect(plan).toContain('K control level 2 CV, % 1.0 1.2 None —');
    // Cells are broken at spaces only: no unit is split at its slash anywhere in the report.
    expect(text).not.toContain('mmol/ L');
  });

  it('prints each material’s components with SD, CV, df, CI, claim, UVL and verdict, in the claim’s terms', () => {
    const section = (m: PrecisionMaterialResult): string => text.slice(text.indexOf(`Material: ${m.name}`));
    expect(section(one)).toContain(`Repeatability ${f(one.repeatability.sd, 3)} ${f(one.repeatability.cv, 1)} 20 ${f(one.repeatability.ci.lower, 3)} to ${f(one.repeatability.ci.upper, 3)} 0.040 ${f(one.uvl.repeatability, 3)} Verified`);
    expect(section(one)).toContain(`Between-day ${f(one.betweenDay.sd, 3)} ${f(one.betweenDay.cv, 1)} — — — — No claim`);
    // "Within-laboratory precision" and "Consistent with the claim" each take two lines of their cells.
    expect(section(two)).toContain(`Within-laboratory ${f(two.withinLab.sd, 3)} ${f(two.withinLab.cv, 1)} ${f(two.withinLab.df, 1)} ${f(two.withinLab.ci.lower, 3)} to ${f(two.withinLab.ci.upper, 3)} 1.2 ${f(two.uvl.withinLab, 1)} Consistent with the precision claim`);
    const note = (terms: string, as: string): string => `The claims are ${terms}, so each estimate is judged as ${as}. Verified: within the claim. ` +
      'Consistent with the claim: above the claim but within its upper verification limit (UVL), the most a laboratory whose true precision equals the claim would see by chance. ' +
      'Not verified: above that limit. Between-day precision has no claim of its own: it is part of the within-laboratory precision.';
    expect(section(one)).toContain(note('SDs in mmol/L', 'an SD'));
    expect(section(two)).toContain(note('CVs in %', 'a CV'));
    // Level 1's days differ less than its replicates: the between-day SD is 0 and said so.
    expect(one.betweenDay.sd).toBe(0);
    expect(section(one)).toContain('so the between-day SD is set to 0 and the within-laboratory SD equals the repeatability SD');
    expect(section(two)).not.toContain('so the between-day SD is set to 0');
    // The headings wrap in their columns: "95% CI of the SD (mmol/L)", "Claim (SD, mmol/L)", "UVL (SD, mmol/L)".
    expect(section(one)).toContain('Component SD (mmol/L) CV (%) df 95% CI of the SD Claim (SD, UVL (SD, Verdict (mmol/L) mmol/L) mmol/L)');
    expect(section(two)).toContain('Component SD (mmol/L) CV (%) df 95% CI of the SD Claim (CV, UVL (CV, Verdict (mmol/L) %) %)');
    expect(text).toContain(`Results 25 results over 5 days; grand mean ${f(two.mean, 3)} mmol/L.`);
  });

  it('prints trueness where a value is assigned, the notes, a picture per material and the warnings', () => {
    const t = one.trueness!;
    expect(text).toContain('Trueness against the assigned value');
    expect(text).toContain('Assigned value 3.50 mmol/L Standard uncertainty of the assigned value 0.02 mmol/L Source of the assigned value Control insert, lot KC-2611 (manufacturer’s mean)');
    expect(text).toContain(`Grand mean of the results ${f(one.mean, 3)} mmol/L Bias (mean − assigned value) ${f(t.bias, 3)} mmol/L (${f(t.biasPercent, 1)}%)`);
    expect(text).toContain(`Standard error of the grand mean ${f(t.se, 3)} mmol/L (${t.seDf} df) Degrees of freedom of the interval ${Math.round(t.df)}`);
    // The interval's label takes two lines beside its value.
    expect(text).toContain(`Verification interval, assigned value ± t·√(SE² + ${f(t.interval.lower, 3)} to ${f(t.interval.upper, 3)} mmol/L u²) (α = 0.05, 2 materials)`);
    expect(text).toContain(`Verdict Trueness verified: the mean ${f(one.mean, 3)} mmol/L lies within the verification interval`);
    expect(text.split('Trueness against the assigned value').length - 1).toBe(1);
    for (const m of [LEVEL_1, LEVEL_2]) expect(text).toContain(`${m}: results by day around the grand mean`);
    expect(text).toContain("result day's mean grand mean ±2 within-laboratory SDs");
    for (const day of DAYS) expect(text).toContain(day);
    expect(text).toContain('No replicate was flagged by the outlier rule.');
    expect(text).toMatch(/Warnings None\./);
  });

  it('prints the design of the analysis as the Findings panel lists it', () => {
    expect(text).toContain(
      `Design of the analysis Materials tested (ℓ) 2 Results analysed (N) 50 (${LEVEL_1}: 25; ${LEVEL_2}: 25) Days with results ${LEVEL_1}: 5; ${LEVEL_2}: 5 ` +
      'Excluded with a reason 1 Significance level α 0.05, shared among 2 materials (α/ℓ = 0.025 for each upper verification limit) ' +
      `CIs of the SDs 95%, two-sided, from the χ² distribution Engine version ${resultsOf(report).engine.version}`,
    );
  });

  it('lists the exclusion with its reason and every row as typed, with material, day and replicate', () => {
    expect(text).toContain(`Exclusions Row Material Day Replicate Result Reason 8 K control level 1 2026-11-10 3 3.81 ${EXCLUDED_REASON}`);
    const lines = pages.flat();
    const table = lines.slice(lines.indexOf('Results as entered'));
    const rows = table.filter((l) => /^\d+ K control level [12] 2026-11-\d\d \d+ /.test(l));
    expect(rows.map((l) => Number(l.split(' ')[0]))).toEqual(report.rows.map((r) => r.position));
    for (const r of report.rows.filter((x) => !x.excluded)) expect(rows[r.position - 1]).toContain(` ${r.day} ${r.replicate} ${r.valueText}`);
    expect(flat(table)).toContain('Excluded: Clot flagged by the analyser');
    expect(flat(table)).toContain('Run again after the clot: first result 3.81 mmol/L');
  });

  it('prints the caution on page 1 and again on the last page, and the footer on every page', () => {
    expect(flat(pages[0])).toContain(CAUTION);
    expect(flat(pages[pages.length - 1])).toContain(CAUTION);
    pages.forEach((lines, k) => expect(flat(lines)).toContain(`Page ${k + 1} of ${pages.length}`));
  });

  it('keeps every line inside the page, never ends a page with a heading and leaves no early page mostly empty', async () => {
    await expectLaidOut(report);
    await expectLaidOut({ ...report, draft: true, signature: null });
  });
});

describe('a precision report in other states', () => {
  it('says there is no current analysis without results, and still prints the plan, the study and the rows', async () => {
    const report = { ...precisionReport(), results: null, signature: null, draft: true };
    const pages = pdfPages(await renderStudyReport(report));
    const text = flat(pages);
    expect(text).toContain('CONCLUSION There is no current analysis of these results and claims, so no findings are shown.');
    expect(text).toContain('Plan and acceptance criteria');
    expect(text).toContain('Kind of study Precision verification (days × replicates)');
    expect(text).toContain('Results as entered');
    expect(text).not.toContain('Material: ');
    expect(flat(pages[pages.length - 1])).toContain('Decision support only.');
    await expectLaidOut(report);
  });

  it('renders stored results that lack fields without failing', async () => {
    const report = { ...precisionReport(), results: { kind: 'precision' } as unknown as StudyReport['results'] };
    const pages = pdfPages(await renderStudyReport(report));
    expect(flat(pages[0])).toContain('No material could be analysed; see the warnings.');
    expect(flat(pages[pages.length - 1])).toContain('Decision support only.');
  });

  it('prints a flagged replicate in its material’s table, in the rows and as a diamond in the legend (10 days × 10 replicates)', async () => {
    const days = Array.from({ length: 10 }, (_, i) => `2026-11-${String(9 + i).padStart(2, '0')}`);
    const report = precisionReport(potassiumRows(days, 10, true), [MATERIALS[0]], { days: 10, replicates: 10 });
    const m = material(report, LEVEL_1);
    expect(m.outliers).toHaveLength(1);
    const o = m.outliers[0];
    const text = flat(pdfPages(await renderStudyReport(report)));
    expect(text).toContain(`Flagged replicate (kept in the analysis unless excluded with a reason) Row Day Replicate Result (mmol/L) Why ${o.position} ${o.day} ${o.replicate} ${f(o.value, 2)} ${o.why}`);
    expect(text).toContain(`${o.position} ${LEVEL_1} ${o.day} ${o.replicate} ${f(o.value, 2)} Flagged by the outlier rule`);
    expect(text).toContain('flagged by the outlier rule');
    // The outlier makes both SDs exceed their limits: said first, with α for the one material.
    expect(m.verdicts).toEqual({ repeatability: 'not-verified', withinLab: 'not-verified' });
    expect(text).toContain(
      'CONCLUSION 2 claims over 1 material: 0 verified, 0 consistent with the claim, 2 not verified. Trueness verified for 1 of 1 material with an assigned value. ' +
      `${LEVEL_1} — Repeatability not verified: SD ${f(m.repeatability.sd, 3)} mmol/L exceeds the upper verification limit ${f(m.uvl.repeatability, 3)} mmol/L of the claim 0.040 mmol/L (α = 0.05, 1 material).`,
    );
    await expectLaidOut(report);
  });

  it('prints an unbalanced design’s note and a CV claim typed with two decimals as typed', async () => {
    const rows = potassiumRows().filter((r) => !(r.material === LEVEL_2 && r.day === DAYS[3] && (r.replicate as number) > 3));
    const materials = [MATERIALS[0], { ...MATERIALS[1], claimRepeatability: 1.05, claimWithinLab: 1.25 }];
    const report = precisionReport(rows.map((r, k) => ({ ...r, position: k + 1 }) as ReportRow), materials);
    const two = material(report, LEVEL_2);
    expect(two.anova.balanced).toBe(false);
    const text = flat(pdfPages(await renderStudyReport(report)));
    expect(text).toContain(`•  ${two.notes[0]}`.replace(/\s+/g, ' '));
    expect(text).toContain('unbalanced, effective day size n0 = ');
    expect(text).toContain('K control level 2 CV, % 1.05 1.25');
    expect(text).toContain(`Repeatability verified: CV ${f(two.repeatability.cv, 2)}% is within the claim 1.05%.`);
  });
});

describe('the Results sheet of a precision verification', () => {
  const report = precisionReport();
  const results = resultsOf(report);
  const one = material(report, LEVEL_1);
  const two = material(report, LEVEL_2);
  const lines = precisionSheet.lines(results, 'mmol/L', 2);
  const line = (section: string, name: string) => lines.find((l) => l.section === section && l.name === name)!;

  it('gives its CIs at 1 − α, with df, claim and UVL columns', () => {
    expect(precisionSheet.level(results)).toBeCloseTo(0.95, 12);
    expect(precisionSheet.columns(0.95).map((c) => c.header)).toEqual(
      ['Section', 'Estimate', 'Value', '95% CI low', '95% CI high', 'df', 'Claim', 'Upper verification limit', 'Unit', 'In words']);
  });

  it('writes each material’s mean, SDs and CVs with CI, df, claim, UVL and the verdict in the PDF’s words', () => {
    const at1 = `Material: ${LEVEL_1}`;
    const at2 = `Material: ${LEVEL_2}`;
    expect(line(at1, 'Results used').cells).toEqual({ value: 25 });
    expect(line(at1, 'Mean').cells).toEqual({ value: one.mean, unit: 'mmol/L' });
    expect(line(at1, 'Repeatability SD')).toEqual({
      section: at1, name: 'Repeatability SD',
      cells: { value: one.repeatability.sd, ciLow: one.repeatability.ci.lower, ciHigh: one.repeatability.ci.upper, df: 20, claim: 0.04, uvl: one.uvl.repeatability, unit: 'mmol/L' },
      formats: { value: '0.000', ciLow: '0.000', ciHigh: '0.000', df: '0', claim: '0.000', uvl: '0.000' },
      words: `Repeatability verified: SD ${f(one.repeatability.sd, 3)} mmol/L is within the claim 0.040 mmol/L.`,
    });
    expect(line(at1, 'Repeatability CV').cells.claim).toBeNull();
    expect(line(at1, 'Between-day SD').cells).toMatchObject({ value: one.betweenDay.sd, ciLow: null, df: null, claim: null });
    expect(line(at1, 'Between-day SD').words).toBe('No claim: part of the within-laboratory SD');
    const cv = line(at2, 'Within-laboratory CV');
    expect(cv.cells).toEqual({
      value: two.withinLab.cv, ciLow: (two.withinLab.ci.lower * 100) / two.mean, ciHigh: (two.withinLab.ci.upper * 100) / two.mean,
      df: two.withinLab.df, claim: 1.2, uvl: two.uvl.withinLab, unit: '%',
    });
    expect(cv.formats).toMatchObject({ value: '0.0', df: '0.0' });
    expect(cv.words).toBe(`Within-laboratory precision consistent with the claim: CV ${f(two.withinLab.cv, 1)}% exceeds the claim 1.2% but not the upper verification limit ${f(two.uvl.withinLab, 1)}% (α = 0.05, 2 materials).`);
    expect(line(at2, 'Within-laboratory SD').words).toBe('The claim is given as a CV');
  });

  it('writes trueness where a value is assigned, and the analysis as a whole', () => {
    const t = one.trueness!;
    const at1 = `Material: ${LEVEL_1}`;
    expect(line(at1, 'Assigned value')).toMatchObject({ cells: { value: 3.5, unit: 'mmol/L' }, words: 'source: Control insert, lot KC-2611 (manufacturer’s mean)' });
    expect(line(at1, 'Bias (mean − assigned value)').cells).toEqual({ value: t.bias, unit: 'mmol/L' });
    expect(line(at1, 'Verification interval').cells).toEqual({ ciLow: t.interval.lower, ciHigh: t.interval.upper, df: t.df, unit: 'mmol/L' });
    expect(line(at1, 'Trueness').words).toBe(
      `Trueness verified: the mean ${f(one.mean, 3)} mmol/L lies within the verification interval ${f(t.interval.lower, 3)} to ${f(t.interval.upper, 3)} mmol/L ` +
      `around the assigned value 3.50 mmol/L (bias ${f(t.bias, 3)} mmol/L, ${f(t.biasPercent, 1)}%).`,
    );
    expect(lines.some((l) => l.section === `Material: ${LEVEL_2}` && l.name === 'Trueness')).toBe(false);
    expect(line('Precision verification', 'Significance level α')).toMatchObject({ cells: { value: 0.05 }, words: 'shared among 2 materials (α/ℓ = 0.025 for each upper verification limit)' });
    expect(line('Precision verification', 'Results excluded').cells).toEqual({ value: 1 });
  });

  it('fills the workbook’s Results sheet through the registry, numbers as numbers', async () => {
    const wb = new ExcelJS.Workbook();
    const ws = resultsSheet(wb, serverKind('precision'), results, { unit: 'mmol/L', decimals: 2, heading: { analysis: 'Analysis 3', findings: 'Current' } });
    const rows = ws.getSheetValues().filter(Boolean) as unknown[][];
    const cv = rows.find((r) => r[1] === `Material: ${LEVEL_2}` && r[2] === 'Within-laboratory CV')!;
    expect(cv.slice(3, 10)).toEqual([two.withinLab.cv, (two.withinLab.ci.lower * 100) / two.mean, (two.withinLab.ci.upper * 100) / two.mean, two.withinLab.df, 1.2, two.uvl.withinLab, '%']);
    const buffer = await wb.xlsx.writeBuffer();
    expect(buffer.byteLength).toBeGreaterThan(1000);
  });
});
