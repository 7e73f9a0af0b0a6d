import type { ComparisonRegression } from '../stats/comparison-types';
import { formatCi, formatNumber, levelLabel, NOT_AVAILABLE, pInWords, withUnit } from './findings-numbers';
import type { ComparisonUnits, FindingsRow } from './findings-rows';

/**
 * The regression section of a method comparison in words, for the findings page and the PDF alike: it
 * answers "how does the candidate read across the range". The slope becomes "reads x% higher (lower) per
 * unit", the intercept an offset at zero, each with its CI and whether that CI includes 1 (0); the
 * linearity check is a sentence naming its test; the correlation is a details line.
 */

export const REGRESSION_HEADING = 'How the candidate reads across the range';

export const REGRESSION_NAMES: Record<string, string> = {
  'passing-bablok': 'Passing–Bablok',
  deming: 'Deming',
  'weighted-deming': 'Weighted Deming',
  ols: 'Ordinary least squares',
};

/** The test of linearity, by name (Passing & Bablok 1983, §3: the cusum of the residual signs against the Kolmogorov–Smirnov distribution). */
export const LINEARITY_TEST = 'the cusum test for linearity of Passing–Bablok';
/** The level the cusum test is judged at: the 5% of the paper's critical value 1.36 (shared/stats/cusum-linearity.ts). */
export const LINEARITY_ALPHA = 0.05;

const ROUGH_LINE = 'judge it from the scatter and the difference plot';

/**
 * How the CIs of slope and intercept were made, as the findings, the PDF and the workbook name them.
 * `interval` is the bootstrap's kind ('percentile' or 'bca'), which the regression's bootstrap follows too.
 */
export function regressionCiWords(ciMethod: ComparisonRegression['ciMethod'] | undefined, interval?: string | null): string {
  if (ciMethod === 'rank') return 'rank-based (Passing & Bablok 1983)';
  if (ciMethod === 'jackknife') return 'jackknife';
  if (ciMethod === 'bootstrap') return interval === 'bca' ? 'BCa bootstrap of resampled pairs' : 'percentile bootstrap of resampled pairs';
  return 'none formed';
}

/** One statement of the section: a short label of our own and its sentence. `path` keys the reporting step's note. */
export interface RegressionStatement {
  key: 'slope' | 'intercept' | 'linearity';
  label: string;
  sentence: string;
  path?: string;
}

export interface RegressionSection {
  heading: string;
  /** Which line, fitted how, and how its CIs were made. */
  method: string;
  statements: RegressionStatement[];
  /** The correlation, for reference only, with why it is no measure of agreement. */
  details: string;
}

export interface RegressionWordsInput {
  regression: ComparisonRegression;
  /** The confidence level, 0.95. */
  level: number;
  units: ComparisonUnits;
  /** The bootstrap kind of the analysis ('percentile' or 'bca'). */
  interval?: string | null;
  /** The convention of the Deming error ratio λ. */
  demingRatioConvention?: string | null;
}

/** "+1.6%", "−0.2%", "0.0%": a slope as the percentage the candidate reads above the comparative per unit. */
function slopePercent(slope: number, decimals: number): string {
  const text = formatNumber((slope - 1) * 100, decimals);
  return `${(slope - 1) * 100 > 0 && Number(text) !== 0 ? '+' : ''}${text}%`;
}

const isZero = (text: string): boolean => Number(text.replace('\u2212', '-')) === 0;

/** "The candidate reads 0.7% higher per unit (slope 1.007, 95% CI 0.998 to 1.016, that is −0.2% to +1.6%). The CI includes 1: …" */
export function slopeSentence(r: ComparisonRegression, level: number, units: ComparisonUnits): string {
  const d = units.decimals;
  const b = r.slope.estimate;
  if (b === null) return 'The slope could not be estimated, so how the candidate reads across the range is not known.';
  const amount = formatNumber(Math.abs((b - 1) * 100), d.percent);
  const head = isZero(amount) ? 'The candidate reads neither higher nor lower per unit' : `The candidate reads ${amount}% ${b > 1 ? 'higher' : 'lower'} per unit`;
  const ci = r.slope.ci;
  if (!ci) return `${head} (slope ${formatNumber(b, d.slope)}). No CI could be formed, so a proportional difference can be neither shown nor ruled out.`;
  const numbers = `slope ${formatNumber(b, d.slope)}, ${levelLabel(level)} CI ${formatCi(ci, d.slope)}, that is ${slopePercent(ci[0], d.percent)} to ${slopePercent(ci[1], d.percent)}`;
  const verdict = ci[0] <= 1 && 1 <= ci[1]
    ? 'The CI includes 1: a proportional difference is not shown.'
    : `The CI excludes 1: the candidate reads proportionally ${ci[0] > 1 ? 'higher' : 'lower'}.`;
  return `${head} (${numbers}). ${verdict}`;
}

/** "At zero the candidate reads 0.05 mmol/L higher, a constant offset (intercept 0.05 mmol/L, 95% CI −0.10 to 0.20 mmol/L). The CI includes 0: …" */
export function interceptSentence(r: ComparisonRegression, level: number, units: ComparisonUnits): string {
  const d = units.decimals.stat;
  const a = r.intercept.estimate;
  if (a === null) return 'The intercept could not be estimated, so a constant offset is not known.';
  const amount = formatNumber(Math.abs(a), d);
  const head = isZero(amount)
    ? 'At zero the candidate reads neither higher nor lower: no offset'
    : `At zero the candidate reads ${withUnit(amount, units.unit)} ${a > 0 ? 'higher' : 'lower'}, a constant offset`;
  const ci = r.intercept.ci;
  if (!ci) return `${head} (intercept ${withUnit(formatNumber(a, d), units.unit)}). No CI could be formed, so an offset can be neither shown nor ruled out.`;
  const numbers = `intercept ${withUnit(formatNumber(a, d), units.unit)}, ${levelLabel(level)} CI ${withUnit(formatCi(ci, d), units.unit)}`;
  const verdict = ci[0] <= 0 && 0 <= ci[1]
    ? 'The CI includes 0: a constant offset is not shown.'
    : `The CI excludes 0: a constant offset is shown, the candidate reading ${ci[0] > 0 ? 'higher' : 'lower'}.`;
  return `${head} (${numbers}). ${verdict}`;
}

/** The linearity check in a sentence naming its test; for the methods without one, where to judge it instead. */
export function linearitySentence(r: ComparisonRegression): string {
  if (r.method !== 'passing-bablok') {
    return `Not tested: ${LINEARITY_TEST} belongs to that method, not to ${REGRESSION_NAMES[r.method] ?? r.method} regression; ${ROUGH_LINE}.`;
  }
  const test = LINEARITY_TEST.charAt(0).toUpperCase() + LINEARITY_TEST.slice(1);
  if (r.linearityP === null) return `${test} could not be run (every point lies on the line, or all on one side of it); ${ROUGH_LINE}.`;
  return r.linearityP < LINEARITY_ALPHA
    ? `${test} finds the points depart from a straight line (${pInWords(r.linearityP)}): one slope and intercept may not describe the whole range; ${ROUGH_LINE}.`
    : `${test} finds no departure from a straight line (${pInWords(r.linearityP)}), so one slope and intercept describe the range studied.`;
}

/** The correlation as a details line, for reference only. */
export function correlationDetails(r: ComparisonRegression, units: ComparisonUnits): string {
  const value = r.correlation === null ? 'could not be computed (no spread in x or y)' : `= ${formatNumber(r.correlation, units.decimals.correlation)}`;
  return `Pearson r ${value}, for reference only: a high r shows the range was wide, not that the methods agree; agreement is judged from the bias and its CI.`;
}

/** "Passing–Bablok regression of the candidate (y) on the comparative method (x); 95% CIs of slope and intercept: rank-based (Passing & Bablok 1983)." */
export function regressionMethod(input: RegressionWordsInput): string {
  const r = input.regression;
  const name = REGRESSION_NAMES[r.method] ?? r.method;
  const ratio = r.demingRatio === null ? '' : `, λ = ${formatNumber(r.demingRatio, 3)}${input.demingRatioConvention ? ` (${input.demingRatioConvention})` : ''}`;
  return `${name} regression of the candidate (y) on the comparative method (x)${ratio}; ${levelLabel(input.level)} CIs of slope and intercept: ${regressionCiWords(r.ciMethod, input.interval)}.`;
}

/** The whole section, in its order: method, slope, intercept, linearity, then the correlation as details. */
export function regressionSection(input: RegressionWordsInput): RegressionSection {
  const { regression: r, level, units } = input;
  return {
    heading: REGRESSION_HEADING,
    method: regressionMethod(input),
    statements: [
      { key: 'slope', label: 'Per unit (slope)', sentence: slopeSentence(r, level, units), path: 'regression.slope' },
      { key: 'intercept', label: 'Offset (intercept)', sentence: interceptSentence(r, level, units), path: 'regression.intercept' },
      { key: 'linearity', label: 'Straight line (linearity)', sentence: linearitySentence(r) },
    ],
    details: correlationDetails(r, units),
  };
}

/** The regression's numbers as table rows (the with-and-without table, the workbook): slope, intercept, the linearity test, r. */
export function regressionRows(r: ComparisonRegression, units: ComparisonUnits): FindingsRow[] {
  const d = units.decimals;
  const rows: FindingsRow[] = [
    { path: 'regression.slope', name: 'Slope', estimate: r.slope.estimate, ci: r.slope.ci, unit: '', decimals: d.slope },
    { path: 'regression.intercept', name: 'Intercept', estimate: r.intercept.estimate, ci: r.intercept.ci, unit: units.unit, decimals: d.stat },
  ];
  if (r.method === 'passing-bablok') {
    const words = r.linearityP === null ? 'not run' : r.linearityP < LINEARITY_ALPHA ? 'departs from a straight line' : 'no departure from a straight line';
    rows.push({ path: 'regression.linearityP', name: `Linearity (${LINEARITY_TEST})`, estimate: null, p: r.linearityP, unit: '', decimals: 0, words });
  }
  rows.push({
    path: 'regression.correlation', name: 'Pearson r (for reference only)', estimate: r.correlation, unit: '', decimals: d.correlation,
    words: r.correlation === null ? NOT_AVAILABLE : undefined,
  });
  return rows;
}
