import { DEMING_RATIO_CONVENTION } from '@shared/stats';
import type { ComparisonPlanResult, ResolvedComparisonPlan } from '@shared/stats/plan-comparison';
import { laboratoryTime } from '@shared/types/lab-time';
import { chance, integer, num, orDash, percent, withUnit } from '../format';
import type { Layout } from '../layout';
import { plotRow } from '../plots/plot-box';
import { powerCurvePlot } from '../plots/power-curve';
import type { ReportSamplePlan, StudyReport } from '../report-model';
import { drawTable } from '../table';
import { COLOR, SIZE } from '../theme';
import { REGRESSION_WORDS } from '../words';
import { decimalsOf } from './comparison-data';
import { warningsList } from './warnings';

export const SAMPLE_PLAN_HEADING = 'Sample size by simulation';
export const PLAN_NOT_RUN = 'A plan by simulation is set, but it has not been run for its current settings, so no sample size is given here.';

/**
 * A share (of simulated studies, a probability) as a percentage to one decimal: 0.8125 → "81.3%", never a rounded
 * certainty ("> 99.9%", "< 0.1%"): the one rule of a computed chance (shared/format/number-format.ts formatChance).
 */
export const share = (value: number | null | undefined): string => chance(value);

/**
 * The comparison's plan by simulation, after the plan's criteria: the truth the planned study was simulated
 * under, in words; the share of simulated studies that end "within" per n and decision level; the
 * recommendation; the engine's warnings; the curves against n. Nothing when no plan is set; one line when a
 * plan is set but has no run for its current settings.
 */
export function samplePlanSection(layout: Layout, report: StudyReport): void {
  const run = report.samplePlan ?? null;
  const isSet = report.settings.samplePlan != null;
  if (!run && !isSet) return;
  layout.subheading(SAMPLE_PLAN_HEADING, run ? 90 : 20);
  if (!run) {
    layout.paragraph(PLAN_NOT_RUN, { color: COLOR.warm });
    return;
  }
  const r = run.results;
  layout.paragraph(
    'Before any data, the planned study was simulated many times at each number of specimens under the truth below, and each simulated study ' +
    'was analysed as the real one will be. The figures are the share of those studies that end “within” the allowable bias at each decision level.',
  );
  layout.keyValues(truthWords(report, run));
  planTable(layout, report, r);
  layout.paragraph(orDash(r.reason), { bold: true });
  warningsList(layout, r.warnings, 'Warnings on the plan');
  if (r.rows?.length) {
    const [box] = plotRow(layout, 1, 250);
    powerCurvePlot(layout.doc, box, {
      title: 'Sample size by simulation: share of simulated studies within the allowable bias, by n',
      levels: (r.settings?.decisionLevels ?? r.rows[0].levels.map((l) => l.level)).map((level, k) => ({
        label: `at ${levelWords(report, level)}`,
        points: r.rows.map((row) => ({ n: row.n, ...row.levels[k] })).filter((p) => p.level !== undefined),
      })),
      targetPower: r.targetPower, maxFalsePass: r.maxFalsePass,
    });
  }
}

const levelWords = (report: StudyReport, level: number): string => withUnit(num(level, decimalsOf(report).value), report.analyte.unit);

/** The stated truth and how it was simulated, as label and value pairs. */
function truthWords(report: StudyReport, run: ReportSamplePlan): [string, string][] {
  const r = run.results;
  const p: Partial<ResolvedComparisonPlan> = r.settings ?? {};
  const unit = report.analyte.unit;
  const d = p.decimals ?? decimalsOf(report).value;
  // The stated truth as it was entered (0.15, 2.5), not in the reporting decimals, which could round it away.
  const given = (v: number | undefined): string => (typeof v === 'number' && Number.isFinite(v) ? String(Number(v.toPrecision(4))).replace('-', '−') : num(null, 0));
  const value = (v: number | undefined): string => withUnit(given(v), unit);
  const constant = (p.errorModel ?? run.plan.errorModel) === 'constant';
  const imprecision = (v: number | undefined): string => (constant ? `SD ${value(v)}` : `CV ${given(v)}%`);
  const regression = p.regression ?? report.settings.regression;
  const isDeming = regression === 'deming' || regression === 'weighted-deming';
  const shape = p.shape ?? (run.plan.shape === 'earlier-study' ? 'values' : run.plan.shape);
  const range = `${value(p.low)} to ${value(p.high)}`;
  const rangeWords = shape === 'log-uniform' ? `${range}, spread evenly on a log scale (as many specimens in each doubling of the concentration)`
    : shape === 'values' ? `drawn with replacement from the ${integer(p.values?.length ?? null)} comparative values of study ${run.plan.earlierStudyId ?? '—'} (${range})`
      : `${range}, spread evenly`;
  const realResamples = report.settings.regressionResamples;
  return [
    ['Imprecision', `${imprecision(p.cvComparative)} for the comparative method and ${imprecision(p.cvCandidate)} for the candidate`],
    ['Error model', constant ? 'Constant: the same SD at every concentration' : 'Proportional: the SD grows with the concentration (a constant CV)'],
    ['True concentrations', rangeWords],
    ['Results', `rounded to ${d === 0 ? 'whole numbers' : `${d} ${d === 1 ? 'decimal' : 'decimals'}`}, as the study reports them`],
    ['Regression', `${REGRESSION_WORDS[regression] ?? regression}; the bias at each level judged on its ${percent(p.level ?? report.settings.confidenceLevel)} CI`],
    ...(isDeming ? [['Deming error ratio', `λ = ${num(p.demingRatio ?? report.settings.demingRatio, 3)}, where ${DEMING_RATIO_CONVENTION}`] as [string, string]] : []),
    ['Simulated studies', `${integer(r.simulations)} at each n`],
    ['Bootstrap resamples', `${integer(r.resamples)} per simulated study: fewer than the analysis of the real study uses` +
      `${realResamples > r.resamples ? ` (${integer(realResamples)} for the regression)` : ''}, for speed`],
    ['Seed', orDash(r.seed)],
    ['Targets', `power at least ${percent(r.targetPower)}: a true bias of half the allowable bias ends “within”; ` +
      `false pass at most ${percent(r.maxFalsePass)}: a true bias equal to the allowable bias ends “within”`],
    ['Run', `Plan run ${run.runId}, finished ${laboratoryTime(run.finishedAt, report.laboratory.timeZone)}`],
  ];
}

/** One row per n and decision level; the rows of the recommended n in semibold. */
function planTable(layout: Layout, report: StudyReport, r: ComparisonPlanResult): void {
  const dStat = decimalsOf(report).stat;
  const rows = (r.rows ?? []).flatMap((row) => row.levels.map((l) => ({ n: row.n, l })));
  layout.subheading('Share of simulated studies that end “within”', 120);
  if (r.recommendedN != null) layout.paragraph(`Rows in semibold: the recommended n (${integer(r.recommendedN)}).`, { size: SIZE.small, color: COLOR.muted });
  drawTable(layout, [
    { header: 'n', weight: 0.6, align: 'right' },
    { header: 'Decision level', weight: 1.3, align: 'right' },
    { header: 'Allowable bias', weight: 1.3, align: 'right' },
    { header: 'True bias 0', weight: 1.2, align: 'right' },
    { header: 'True bias half the allowable (power)', weight: 1.6, align: 'right' },
    { header: 'True bias equal to the allowable (false pass)', weight: 1.6, align: 'right' },
  ], rows.map(({ n, l }) => [
    integer(n), levelWords(report, l.level), withUnit(`±${num(l.allowable, dStat)}`, report.analyte.unit),
    share(l.powerAtZero), share(l.powerAtHalf), share(l.falsePass),
  ]), { breakAtSpaces: true, strong: (k) => r.recommendedN != null && rows[k].n === r.recommendedN });
}
