import { forEachResample, type ResampleSettings } from './bootstrap';
import { summariseReplicates, type IntervalMethod } from './bootstrap-estimate';
import type { Interval } from './confidence-interval';
import { jackknifeInterval } from './jackknife';
import { cusumLinearity } from './cusum-linearity';
import { passingBablok } from './passing-bablok';
import { lineFitter, type RegressionMethod } from './regression-fitters';
import { slopeOrder, type SlopeOrder } from './slope-selection';

/**
 * Regression of the candidate (y) on the comparative method (x), with predicted bias at decision levels:
 *   bias(Xc) = a + (b − 1)·Xc  (CLSI EP09 practice).
 * Passing–Bablok reports its own rank-based CIs for slope and intercept and the cusum linearity p-value;
 * Deming, weighted Deming and least squares get CIs by bootstrap of pairs (percentile or BCa) or, as an
 * option, by the jackknife (estimate ± t(n − 1)·SE, Linnet 1990). Decision-level biases always get
 * resampling CIs of the chosen kind. Resamples whose fit is undefined are left out and counted.
 * The fitted line's pointwise CI band (the line a + b·x at BAND_POINTS values of x evenly spread over the
 * comparative range, each with a CI of the same kind from the same resamples or jackknife fits) is what the
 * scatter plots draw around the line: it is x plus the decision-level bias CI at that x, the same statistic.
 */
export interface Estimate { estimate: number; ci: Interval | null }

/** The number of x values at which the line's CI band is estimated. */
export const BAND_POINTS = 21;

/** The fitted line at one x, with its CI (null where no CI could be formed). */
export interface BandPoint { x: number; fit: number; ci: Interval | null }

export interface RegressionOptions {
  method: RegressionMethod;
  lambda: number;
  level: number;
  interval: IntervalMethod;
  ciMethod: 'bootstrap' | 'jackknife';
  decisionLevels: number[];
  settings: ResampleSettings;
  /** Values of x at which the line's CI band is estimated (default BAND_POINTS; 0 leaves the band out, as plans do). */
  bandPoints?: number;
}

export interface RegressionResult {
  method: RegressionMethod;
  slope: Estimate;
  intercept: Estimate;
  linearityP: number | null;
  ciMethod: 'rank' | 'bootstrap' | 'jackknife';
  decisionLevelBias: Estimate[];
  /** The fitted line with its pointwise CI from the lowest to the highest comparative value. */
  band: BandPoint[];
  undefinedResamples: number;
  /** Names of the estimates whose BCa interval could not be formed (their CI is the percentile interval). */
  bcaFailed: string[];
}

export function regression(x: Float64Array, y: Float64Array, options: RegressionOptions): RegressionResult {
  const n = x.length;
  const slopes = options.method === 'passing-bablok' ? slopeOrder(x, y) : undefined;
  const fit = lineFitter(options.method, x, y, options.lambda, slopes);
  const full = fit(new Int32Array(n).fill(1));
  if (!Number.isFinite(full.slope)) throw new RangeError('regression requires spread in x and a defined slope');
  const levels = options.decisionLevels;
  const bandX = bandValues(x, options.bandPoints ?? BAND_POINTS);
  const values = new Float64Array(2 + levels.length + bandX.length);
  const statistics = (line: { slope: number; intercept: number }): Float64Array => {
    values[0] = line.slope;
    values[1] = line.intercept;
    for (let k = 0; k < levels.length; k++) values[k + 2] = line.intercept + (line.slope - 1) * levels[k];
    for (let g = 0; g < bandX.length; g++) values[g + 2 + levels.length] = line.intercept + line.slope * bandX[g];
    return values;
  };
  const estimates = Array.from(statistics(full));
  const needJackknife = options.ciMethod === 'jackknife' || options.interval === 'bca';
  const jack = needJackknife ? jackknifeFits(n, fit, statistics) : null;
  let cis: (Interval | null)[];
  let undefinedResamples = 0;
  const bcaFailed: string[] = [];
  if (options.ciMethod === 'jackknife') {
    cis = estimates.map((e, k) => jackknifeInterval(e, jack![k], options.level));
  } else {
    const reps = estimates.map(() => new Float64Array(options.settings.resamples));
    let kept = 0;
    forEachResample(n, options.settings, (counts) => {
      statistics(fit(counts));
      if (!values.every(Number.isFinite)) { undefinedResamples++; return; }
      for (let k = 0; k < values.length; k++) reps[k][kept] = values[k];
      kept++;
    });
    cis = estimates.map((e, k) => {
      const summary = summariseReplicates(reps[k].subarray(0, kept), e, options.level, options.interval, jack?.[k]);
      if (summary.bcaFailed && k < 2 + levels.length) bcaFailed.push(k === 0 ? 'the slope' : k === 1 ? 'the intercept' : `the bias at decision level ${levels[k - 2]}`);
      return summary.ci;
    });
  }
  const result: RegressionResult = {
    method: options.method,
    slope: { estimate: estimates[0], ci: cis[0] },
    intercept: { estimate: estimates[1], ci: cis[1] },
    linearityP: null,
    ciMethod: options.ciMethod,
    decisionLevelBias: levels.map((_, k) => ({ estimate: estimates[k + 2], ci: cis[k + 2] })),
    band: bandX.map((bx, g) => ({ x: bx, fit: estimates[g + 2 + levels.length], ci: cis[g + 2 + levels.length] })),
    undefinedResamples,
    bcaFailed,
  };
  return slopes ? withRankCis(result, x, y, options.level, slopes) : result;
}

/** `points` values of x from the lowest to the highest comparative value, evenly spaced. */
function bandValues(x: Float64Array, points: number): number[] {
  if (points < 1) return [];
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of x) { if (v < lo) lo = v; if (v > hi) hi = v; }
  return Array.from({ length: points }, (_, g) => (g === points - 1 ? hi : lo + ((hi - lo) * g) / Math.max(1, points - 1)));
}

function withRankCis(result: RegressionResult, x: Float64Array, y: Float64Array, level: number, slopes: SlopeOrder): RegressionResult {
  const pb = passingBablok(x, y, level, slopes);
  const linearity = cusumLinearity(x, y, pb.slope, pb.intercept);
  return {
    ...result,
    slope: { estimate: pb.slope, ci: pb.slopeCi },
    intercept: { estimate: pb.intercept, ci: pb.interceptCi },
    linearityP: linearity.pValue,
    ciMethod: 'rank',
  };
}

function jackknifeFits(n: number, fit: (m: Int32Array) => { slope: number; intercept: number }, statistics: (l: { slope: number; intercept: number }) => Float64Array): Float64Array[] {
  const multiplicity = new Int32Array(n).fill(1);
  let out: Float64Array[] = [];
  for (let i = 0; i < n; i++) {
    multiplicity[i] = 0;
    const values = statistics(fit(multiplicity));
    multiplicity[i] = 1;
    if (i === 0) out = Array.from(values, () => new Float64Array(n));
    values.forEach((v, k) => (out[k][i] = v));
  }
  return out;
}
