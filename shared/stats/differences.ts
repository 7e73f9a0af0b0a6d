import { reportedDecimals, roundSignificant, roundTo } from './precision';

/**
 * Paired differences, candidate (y) minus comparative (x):
 * - 'absolute':     d = y − x
 * - 'percent-mean': d = 100 · (y − x) / ((x + y)/2)   (Bland & Altman 1999, Stat Methods Med Res 8:135)
 * - 'percent-x':    d = 100 · (y − x) / x
 * Each difference is rounded to the precision the inputs carry: absolute differences to the largest
 * number of decimals reported in x and y (so 5.2 − 4.9 is exactly 0.3), percentages to 12 significant
 * digits. The rounding is below the data's resolution, so it changes no estimate, only makes ties exact.
 */
export type DifferenceType = 'absolute' | 'percent-mean' | 'percent-x';

export interface PairedDifferences {
  differences: Float64Array;
  means: Float64Array;
  /** Decimals judged from the inputs (absolute differences carry this many). */
  decimals: number;
}

export function pairedDifferences(x: ArrayLike<number>, y: ArrayLike<number>, type: DifferenceType): PairedDifferences {
  if (x.length !== y.length) throw new RangeError('pairedDifferences requires x and y of equal length');
  const n = x.length;
  const decimals = Math.max(reportedDecimals(x), reportedDecimals(y));
  const differences = new Float64Array(n);
  const means = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const raw = roundTo(y[i] - x[i], decimals);
    means[i] = (x[i] + y[i]) / 2;
    if (type === 'absolute') differences[i] = raw;
    else {
      const base = type === 'percent-mean' ? means[i] : x[i];
      if (base === 0) throw new RangeError(`pairedDifferences requires a non-zero ${type === 'percent-x' ? 'x' : 'pair mean'} for percent differences (pair ${i + 1})`);
      differences[i] = roundSignificant((100 * raw) / base);
    }
  }
  return { differences, means, decimals };
}
