import { renderStudyReport } from './render-report';
import type { StudyReport } from './report-model';
import { comparisonPlanReport, comparisonReport, establishReport, verifyReport } from './testing/fixtures';
import { layoutFaults, pdfLayout } from './testing/pdf-layout';
import { flat, pdfPages } from './testing/pdf-text';

/**
 * The plans in the study PDF: a method comparison's sample size by simulation (the run's truth, its figures per n
 * and decision level, the recommendation, the warnings and the curves), how often a verification's rule accepts,
 * and what more reference values buy in an establishment. Wording is written out here, not imported, so a change
 * of what is printed fails a test.
 */
const NOT_RUN = 'A plan by simulation is set, but it has not been run for its current settings, so no sample size is given here.';
const pct = (v: number): string => `${(100 * v).toFixed(1)}%`;
const text = async (report: StudyReport): Promise<string> => flat(pdfPages(await renderStudyReport(report)));

describe('the sample size by simulation of a method comparison', () => {
  const report = comparisonPlanReport();
  const results = report.samplePlan!.results;
  let printed: string;

  beforeAll(async () => {
    printed = await text(report);
  });

  it('prints every n and decision level of the run with its three shares, to one decimal', () => {
    expect(results.rows.map((r) => r.n)).toEqual([20, 40, 60, 80, 100, 120]);
    expect(printed).toContain('Sample size by simulation');
    // The header's cells wrap, so the extracted text interleaves their lines: each cell's first words are there.
    for (const cell of ['Decision level', 'Allowable bias', 'True bias 0', 'True bias half the', 'True bias equal to']) expect(printed).toContain(cell);
    for (const row of results.rows) {
      for (const l of row.levels) {
        expect(printed).toContain(`${row.n} ${l.level.toFixed(1)} mmol/L ±0.30 mmol/L ${pct(l.powerAtZero)} ${pct(l.powerAtHalf)} ${pct(l.falsePass)}`);
      }
    }
  });

  it('states the truth it simulated, the resamples (fewer than a real analysis) and the targets, then the recommendation and the warnings', () => {
    expect(printed).toContain('Imprecision CV 2% for the comparative method and CV 2.5% for the candidate');
    expect(printed).toContain('Error model Proportional: the SD grows with the concentration (a constant CV)');
    expect(printed).toContain('True concentrations 2 mmol/L to 25 mmol/L, spread evenly');
    expect(printed).toContain('Regression Passing–Bablok; the bias at each level judged on its 95% CI');
    expect(printed).not.toContain('Deming error ratio');
    expect(printed).toContain('Simulated studies 100 at each n');
    expect(printed).toContain('Bootstrap resamples 100 per simulated study: fewer than the analysis of the real study uses (1,000 for the regression), for speed');
    expect(printed).toContain('Seed report-test');
    expect(printed).toContain('Targets power at least 80%: a true bias of half the allowable bias ends “within”; false pass at most 5%: a true bias equal to the allowable bias ends “within”');
    expect(printed).toContain('Run Plan run 311, finished 2026-11-02 07:48 America/Halifax (UTC−04:00)');
    expect(results.reason.length).toBeGreaterThan(40);
    expect(printed).toContain(results.reason);
    // 100 simulated studies of 100 resamples each: the engine warns of both, in one sentence.
    expect(results.warnings).toEqual(['Each simulated study uses 100 bootstrap resamples (a real analysis uses more); the figures carry a Monte Carlo error of up to 5% (one SE).']);
    expect(printed).toContain(results.warnings[0]);
    // In reading order: the plan's criteria, the truth, the table, the recommendation, the warnings, the curves; then the amendments.
    const order = ['Plan approval Approved by', 'Sample size by simulation', 'Imprecision CV 2%', 'True bias 0', results.reason,
      'Warnings on the plan', 'Sample size by simulation: share of simulated studies within the allowable bias, by n', 'Criteria changed after approval'];
    const at = order.map((phrase) => printed.indexOf(phrase));
    expect(at.every((i) => i >= 0)).toBe(true);
    expect([...at].sort((a, b) => a - b)).toEqual(at);
  });

  it('names each level and line style of the curves in the legend', () => {
    for (const level of ['3.0', '10.0', '20.0']) expect(printed).toContain(`at ${level} mmol/L`);
    for (const line of ['true bias half the allowable (power)', 'true bias equal to the allowable (false pass)', 'true bias 0', 'targets: power 80%, false pass 5%']) {
      expect(printed).toContain(line);
    }
  });

  it('sets the recommended n in semibold and says so, when the grid has one', async () => {
    const recommended = comparisonPlanReport({}, { allowableBiasPercent: 5 });
    const r = recommended.samplePlan!.results;
    expect(r.recommendedN).toBe(80);
    const out = await text(recommended);
    expect(out).toContain(`Rows in semibold: the recommended n (${r.recommendedN}).`);
    expect(out).toContain(r.reason);
    expect(printed).not.toContain('Rows in semibold');
  });

  it('prints the Deming ratio, the SDs as entered and a log scale when the plan has them', async () => {
    const deming = comparisonPlanReport(
      { errorModel: 'constant', cvComparative: 0.15, cvCandidate: 0.2, shape: 'log-uniform', n: [20, 40] },
      { regression: 'deming', demingRatio: 0.56 },
    );
    const out = await text(deming);
    expect(out).toContain('Imprecision SD 0.15 mmol/L for the comparative method and SD 0.2 mmol/L for the candidate');
    expect(out).toContain('Error model Constant: the same SD at every concentration');
    expect(out).toContain('True concentrations 2 mmol/L to 25 mmol/L, spread evenly on a log scale');
    expect(out).toContain('Regression Deming; the bias at each level judged on its 95% CI');
    expect(out).toContain('Deming error ratio λ = 0.560, where');
  });

  it('says the plan has not been run for its settings when it is set without a current run', async () => {
    const unrun = comparisonPlanReport({}, {}, false);
    expect(unrun.settings.samplePlan).not.toBeNull();
    const out = await text(unrun);
    expect(out).toContain(`Sample size by simulation ${NOT_RUN}`);
    expect(out).not.toContain('True bias half the allowable');
    expect(out).not.toContain('Warnings on the plan');
  });

  it('prints nothing of a plan by simulation when none is set', async () => {
    const plain = comparisonReport(40);
    expect(plain.settings.samplePlan).toBeUndefined();
    const out = await text(plain);
    expect(out).not.toContain('Sample size by simulation');
    expect(out).not.toContain(NOT_RUN);
    expect(out).toContain('Plan approval Approved by');
  });

  it('lays out a 12-point grid with 3 decision levels, and 6 levels, with no text past the margins, no heading ending a page and no half-empty page', async () => {
    const grid = [20, 30, 40, 50, 60, 80, 100, 120, 140, 160, 180, 200];
    for (const sample of [
      comparisonPlanReport({ n: grid }, { regression: 'ols' }),
      comparisonPlanReport({ n: grid.slice(0, 8) }, { regression: 'ols', decisionLevels: [3, 5, 7, 10, 15, 20] }),
      { ...comparisonPlanReport({ n: grid }, { regression: 'ols' }), results: null, signature: null, draft: true },
    ]) {
      expect(sample.samplePlan!.results.rows.length * sample.samplePlan!.results.rows[0].levels.length).toBeGreaterThanOrEqual(36);
      const pdf = await renderStudyReport(sample);
      expect(layoutFaults(pdfLayout(pdf))).toEqual([]);
      // The draft's watermark falls across a line of the table here and there: read the text without it.
      const out = flat(pdfPages(pdf)).replace(/\s*DRAFT — not signed\s*/g, ' ');
      // Every row of the table is printed once, its header again on each page it runs to.
      for (const row of sample.samplePlan!.results.rows) {
        for (const l of row.levels) expect(out.split(` ${row.n} ${l.level.toFixed(1)} mmol/L ±0.30 mmol/L ${pct(l.powerAtZero)} `).length - 1).toBe(1);
      }
    }
  });

  it('gives the same bytes for the same plan, run and built twice', async () => {
    const [a, b] = [await renderStudyReport(report), await renderStudyReport(comparisonPlanReport())];
    expect(a.equals(b)).toBe(true);
  });
});

describe('how often a verification’s rule accepts', () => {
  it('prints the binomial shares at the usual 20 values: with 10% outside, 67.7% at first and 89.6% with the retest', async () => {
    // 67.7% and 89.6%: P(X ≤ 2), X ~ Binomial(20, 0.1), and with a retest of 20 (scipy.stats.binom, as plan-transference.ts states).
    const out = await text(verifyReport(20));
    expect(out).toContain('How often the rule accepts');
    for (const cell of ['True share of the population outside the', 'Accepted at first (at most 2 of 20', 'Accepted, counting the retest']) expect(out).toContain(cell);
    expect(out).toContain('10% 67.7% 89.6%');
    expect(out).toContain('with 10% of it truly outside the stated interval, it still accepts 67.7% of the time at first and 89.6% with the retest');
    expect(out).toContain('With 20 values (the usual number; none is planned)');
    // A share short of certainty is never rounded to 100%.
    expect(out).toMatch(/2\.5% 98\.7% > 99\.9%/);
    for (const share of ['5%', '15%', '20%', '25%']) expect(out).toMatch(new RegExp(` ${share} \\d+\\.\\d% \\d+\\.\\d% `));
  });

  it('uses the planned number of values and 10% of it as the most allowed outside', async () => {
    const planned = verifyReport(20);
    const out = await text({ ...planned, settings: { ...planned.settings, plannedSpecimens: 40 } });
    // P(X ≤ 4), X ~ Binomial(40, 0.1), summed here term by term.
    const choose = (n: number, k: number): number => (k === 0 ? 1 : (choose(n, k - 1) * (n - k + 1)) / k);
    const first = [0, 1, 2, 3, 4].reduce((sum, k) => sum + choose(40, k) * 0.1 ** k * 0.9 ** (40 - k), 0);
    const retest = first + (1 - first) * first;
    expect(out).toContain('With 40 values (as planned)');
    expect(out).toContain('Accepted at first (at most 4 of 40');
    expect(out).toContain(`10% ${pct(first)} ${pct(retest)}`);
  });
});

describe('what more reference values buy in an establishment', () => {
  it('prints the ranks of each limit’s 90% CI, its coverage and expected span per n, and the smallest n that has one', async () => {
    const out = await text(establishReport(130));
    expect(out).toContain('What more reference values buy');
    // n = 120: the 90% CI of the 2.5th percentile runs from the 1st to the 7th value, of the 97.5th from the 114th to the 120th;
    // coverage P(1 ≤ B ≤ 6), B ~ Binomial(120, 0.025) = 0.920467 (computed here with Python's math.comb), printed as a computed
    // chance to one decimal (shared/format/number-format.ts formatChance), as the Setup panel shows it: 92.0%; span (7 − 1)/121 = 4.96 percentile points.
    expect(out).toContain('120 1–7 92.0% 5.0 114–120 92.0% 5.0');
    for (const n of [150, 200, 240, 300, 400]) expect(out).toMatch(new RegExp(` ${n} \\d+–\\d+ \\d+\\.\\d% \\d\\.\\d \\d+–\\d+ \\d+\\.\\d% \\d\\.\\d `));
    expect(out).toContain('n below 119 gives no 90% CI of the 2.5th or 97.5th percentile from ranks.');
    expect(out).not.toContain('the planned n');
  });

  it('adds the planned n to the grid, in semibold, with no CI when it is too small', async () => {
    const base = establishReport(130);
    const small = await text({ ...base, settings: { ...base.settings, plannedSpecimens: 100 } });
    expect(small).toContain('100 none — — none — —');
    expect(small).toContain('Row in semibold: the planned n (100).');
    const inGrid = await text({ ...base, settings: { ...base.settings, plannedSpecimens: 150 } });
    expect(inGrid.match(/ 150 \d+–\d+ /g)).toHaveLength(1);
    expect(inGrid).toContain('Row in semibold: the planned n (150).');
  });
});
