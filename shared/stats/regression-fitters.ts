import { demingFromSums, olsFromSums, type LineFit } from './deming';
import { pairSums } from './pair-sums';
import { slopeOrder, type SlopeOrder } from './slope-selection';
import { weightedPassingBablok } from './passing-bablok-weighted';
import { weightedDeming } from './weighted-deming';

export type RegressionMethod = 'passing-bablok' | 'deming' | 'weighted-deming' | 'ols';

/** A line fit of the rows taken with multiplicities (bootstrap counts, or 0/1 for the jackknife). */
export type LineFitter = (multiplicity: Int32Array) => LineFit;

/**
 * One fitter per method, each reusing its buffers across calls, so that the bootstrap loop allocates
 * nothing: Passing–Bablok selects weighted ranks of slopes prepared once (passing-bablok-weighted.ts,
 * slope-selection.ts); Deming and ordinary least squares use weighted sums (pair-sums.ts); weighted
 * Deming iterates (weighted-deming.ts).
 */
export function lineFitter(method: RegressionMethod, x: Float64Array, y: Float64Array, lambda: number, order?: SlopeOrder): LineFitter {
  switch (method) {
    case 'passing-bablok': {
      const slopes = order ?? slopeOrder(x, y);
      const scratch = new Float64Array(x.length);
      return (m) => weightedPassingBablok(slopes, x, y, m, scratch);
    }
    case 'deming':
      return (m) => demingFromSums(pairSums(x, y, m), lambda);
    case 'weighted-deming': {
      const weights = new Float64Array(x.length);
      return (m) => weightedDeming(x, y, lambda, m, weights);
    }
    case 'ols':
      return (m) => olsFromSums(pairSums(x, y, m));
  }
}
